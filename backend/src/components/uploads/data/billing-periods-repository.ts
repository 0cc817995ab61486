import type { EntityManager } from 'typeorm';
import type { VolumeUnit } from '@shared/units/volume-units';
import { affected } from './affected';

/** A billing period this upload stored. */
export interface StoredPeriod {
  meterId: number;
  startDate: string;
  endDate: string;
  gallons: number;
  original: number;
  unit: VolumeUnit;
  estimated: boolean;
}

const dateOnly = (v: unknown) => (v instanceof Date ? v.toISOString().slice(0, 10) : String(v).slice(0, 10));

/** Billing periods, and the interval readings they must not double count. */
export class BillingPeriodsRepository {
  async ofUpload(em: EntityManager, uploadId: number): Promise<StoredPeriod[]> {
    const rows: Array<Record<string, unknown>> = await em.query(
      `SELECT meter_id, start_date, end_date, volume_gal, original_value, original_unit, estimated
       FROM meter_billing_period WHERE upload_id = ? ORDER BY meter_id, start_date`,
      [uploadId],
    );
    return rows.map((r) => ({
      meterId: Number(r['meter_id']),
      startDate: dateOnly(r['start_date']),
      endDate: dateOnly(r['end_date']),
      gallons: Number(r['volume_gal']),
      original: Number(r['original_value']),
      unit: r['original_unit'] as VolumeUnit,
      estimated: Number(r['estimated']) === 1,
    }));
  }

  /** Another upload's reading of this meter inside [from, to): the upload that has it, or null. */
  async readingInside(
    em: EntityManager,
    meterId: number,
    from: Date,
    to: Date,
    uploadId: number,
  ): Promise<number | null> {
    const [hit] = await em.query(
      `SELECT upload_id FROM meter_reading WHERE meter_id = ? AND start_utc >= ? AND start_utc < ? AND
        upload_id <> ? LIMIT 1`,
      [meterId, from, to, uploadId],
    );
    return hit ? Number(hit.upload_id) : null;
  }

  async remove(em: EntityManager, meterId: number, startDate: string, uploadId: number): Promise<number> {
    return affected(
      await em.query('DELETE FROM meter_billing_period WHERE meter_id = ? AND start_date = ? AND upload_id = ?', [
        meterId,
        startDate,
        uploadId,
      ]),
    );
  }

  async markSpread(em: EntityManager, meterId: number, startDate: string, method: 'eto' | 'even'): Promise<void> {
    await em.query('UPDATE meter_billing_period SET spread = ? WHERE meter_id = ? AND start_date = ?', [
      method,
      meterId,
      startDate,
    ]);
  }
}
