import type { QueryRunner } from 'typeorm';
import { differenceRegisterReads } from '@shared/ingest/register-differencing';
import type { VolumeUnit } from '@shared/units/volume-units';
import { toGallons } from '@shared/units/volume-units';
import type { RejectionDto } from '@shared/uploads/upload';
import { sqlUtc } from '../data/ingest-targets';
import { affected, type IngestWriter } from '../data/ingest-writer';
import type { IngestRefs } from './ingest-refs';

/**
 * After an upload's register reads are stored: differences every touched meter's reads (stored and new
 * together, so a monthly file continues last month's) into interval volumes, which are stored with this upload.
 * Problems on this upload's reads (negative steps, implausible rollovers) are reported; meter swaps are notices.
 */
export async function deriveRegisterVolumes(
  qr: QueryRunner,
  writer: IngestWriter,
  refs: IngestRefs,
  uploadId: number,
): Promise<{ volumes: number; problems: number; rejections: RejectionDto[] }> {
  const byId = new Map([...refs.meters.values()].map((m) => [m.id, m]));
  const out = { volumes: 0, problems: 0, rejections: [] as RejectionDto[] };
  let rollovers = 0;
  for (const meterId of await writer.distinct('meter_id')) {
    const meter = byId.get(meterId)!;
    const stored: Array<{ read_at: Date; register_value: string; unit: VolumeUnit; upload_id: number }> =
      await qr.query(
        `SELECT read_at, register_value, unit, upload_id FROM meter_register_read WHERE meter_id =
          ? ORDER BY read_at, position`,
        [meterId],
      );
    const rowsOfThisFile = new Map<string, number>();
    for (const s of await writer.stagedRows('meter_id = ? ORDER BY row_no', [meterId])) {
      const at = new Date(s['read_at'] as Date).toISOString();
      if (!rowsOfThisFile.has(at)) rowsOfThisFile.set(at, Number(s['row_no']));
    }
    const reads = stored.map((r) => ({
      meterRef: meter.ref,
      atUtc: new Date(r.read_at).toISOString(),
      value: Number(r.register_value),
      unit: r.unit,
    }));
    const result = differenceRegisterReads({ meterRef: meter.ref, registers: meter.registers }, reads);
    rollovers += result.rollovers.length;
    for (const p of result.problems) {
      const row = rowsOfThisFile.get(p.atUtc);
      if (row === undefined) continue; // a problem between earlier uploads' reads was reported then
      if (p.severity === 'error') out.problems++;
      out.rejections.push({
        row,
        column: null,
        kind: p.severity === 'error' ? 'rejected' : 'notice',
        message: `${meter.ref} at ${p.atUtc.slice(0, 16).replace('T', ' ')} UTC: ${p.message}`,
      });
    }
    const values = result.volumes.map((v) => [
      meterId,
      sqlUtc(v.startUtc),
      v.minutes,
      toGallons(v.volume, v.unit).toFixed(4),
      v.volume.toFixed(6),
      v.unit,
      uploadId,
    ]);
    for (let i = 0; i < values.length; i += 1000) {
      // IGNORE: a volume between two earlier reads is already stored by the upload that brought them.
      const inserted = await qr.query(
        `INSERT IGNORE INTO meter_reading (meter_id, start_utc, minutes, volume_gal,
          original_value, original_unit, upload_id) VALUES ?`,
        [values.slice(i, i + 1000)],
      );
      out.volumes += affected(inserted);
    }
  }
  out.rejections.push({
    row: 0,
    column: null,
    kind: 'notice',
    message:
      `${out.volumes} interval volume(s) worked out from the register ` +
      `reads${rollovers ? ` (${rollovers} dial rollover(s))` : ''}.`,
  });
  return out;
}
