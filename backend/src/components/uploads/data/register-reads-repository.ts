import type { EntityManager } from 'typeorm';
import type { RegisterRecord } from '@shared/ingest/ingest-records';
import type { VolumeUnit } from '@shared/units/volume-units';
import { affected } from './affected';

/** A stored register read as differencing wants it, with the upload that brought it. */
export interface StoredRead extends RegisterRecord {
  uploadId: number;
}

/** One derived interval volume, ready to store. */
export interface DerivedVolume {
  meterId: number;
  startSql: string;
  minutes: number;
  gallons: number;
  original: number;
  unit: VolumeUnit;
  flags: number;
}

/** Register reads of a meter (stored and this upload's) and the volumes worked out from them. */
export class RegisterReadsRepository {
  async reads(em: EntityManager, meterId: number, meterRef: string): Promise<StoredRead[]> {
    const rows: Array<Record<string, unknown>> = await em.query(
      `SELECT read_at, register_value, unit, upload_id, serial, multiplier, digits, estimated
       FROM meter_register_read WHERE meter_id = ? ORDER BY read_at, position`,
      [meterId],
    );
    return rows.map((r) => {
      const read: StoredRead = {
        meterRef,
        atUtc: new Date(r['read_at'] as Date).toISOString(),
        value: Number(r['register_value']),
        unit: r['unit'] as VolumeUnit,
        uploadId: Number(r['upload_id']),
      };
      if (r['serial'] !== null) read.serial = String(r['serial']);
      if (r['multiplier'] !== null) read.multiplier = Number(r['multiplier']);
      if (r['digits'] !== null) read.digits = Number(r['digits']);
      if (Number(r['estimated'])) read.estimated = true;
      return read;
    });
  }

  /** Stores volumes under the upload; IGNORE: a volume between two earlier reads was stored by their upload. */
  async insertVolumes(em: EntityManager, uploadId: number, volumes: DerivedVolume[]): Promise<number> {
    let stored = 0;
    for (let i = 0; i < volumes.length; i += 1000) {
      const values = volumes
        .slice(i, i + 1000)
        .map((v) => [
          v.meterId,
          v.startSql,
          v.minutes,
          v.gallons.toFixed(4),
          v.original.toFixed(6),
          v.unit,
          v.flags,
          uploadId,
        ]);
      stored += affected(
        await em.query(
          `INSERT IGNORE INTO meter_reading (meter_id, start_utc, minutes, volume_gal, original_value,
            original_unit, flags, upload_id) VALUES ?`,
          [values],
        ),
      );
    }
    return stored;
  }
}
