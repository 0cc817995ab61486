import type { QueryRunner } from 'typeorm';
import type { RejectionDto } from '@shared/uploads/upload';
import { affected } from '../data/ingest-writer';
import type { IngestRefs } from './ingest-refs';
import type { MeterSpan } from './interval-spans';

const LISTED = 1000;
const utc = (v: unknown) => `${new Date(v as string).toISOString().slice(0, 16).replace('T', ' ')} UTC`;

/** Only readings up to a day long are compared (register-derived volumes are longer). */
export const OVERLAP_MAX_MINUTES = 1440;

/**
 * Same meter, overlapping time, different interval length (an hourly utility file and a 15-minute logger file):
 * keeping both would count that water twice, and the key (meter, start, minutes) cannot see it. Readings this
 * upload just stored that overlap another upload's readings of another length are taken out again and reported
 * as conflicts. Runs in the upload's transaction; register-derived volumes (longer than a day) are not compared.
 * `known` are the upload's spans when the caller knows them exactly (every line sent was stored); otherwise they
 * are read back from the table, which costs seconds per million rows.
 */
export async function withdrawLengthOverlaps(
  qr: QueryRunner,
  uploadId: number,
  refs: IngestRefs,
  known?: MeterSpan[],
): Promise<{ withdrawn: number; rejections: RejectionDto[] }> {
  const meterRefs = new Map([...refs.meters.values()].map((m) => [m.id, m.ref]));
  const spans = known ?? (await storedSpans(qr, uploadId));
  const out = { withdrawn: 0, rejections: [] as RejectionDto[] };
  for (const span of spans) {
    const lengths = span.lengths;
    // Cheap test first: any other upload's reading of another length in this meter's span at all?
    const [maybe] = await qr.query(
      `SELECT 1 AS hit FROM meter_reading WHERE meter_id = ? AND start_utc >= ? - INTERVAL 1440
        MINUTE AND start_utc < ? AND upload_id <> ? AND minutes <= 1440 AND minutes NOT IN (?)
        LIMIT 1`,
      [span.meterId, span.first, span.last, uploadId, lengths],
    );
    if (!maybe) continue;
    const pairs: Array<{ a_start: Date; a_minutes: number; r_start: Date; r_minutes: number; r_upload: number }> =
      await qr.query(
        `SELECT a.start_utc AS a_start, a.minutes AS a_minutes, MIN(r.start_utc) AS r_start,
          MIN(r.minutes) AS r_minutes, MIN(r.upload_id) AS r_upload
       FROM meter_reading a JOIN meter_reading r ON r.meter_id = a.meter_id
         AND r.start_utc >= a.start_utc - INTERVAL 1440 MINUTE AND r.start_utc < a.start_utc +
          INTERVAL a.minutes MINUTE
         AND r.start_utc + INTERVAL r.minutes MINUTE > a.start_utc
         AND r.upload_id <> a.upload_id AND r.minutes <> a.minutes AND r.minutes <= 1440
       WHERE a.meter_id = ? AND a.upload_id = ? AND a.minutes <= 1440
       GROUP BY a.start_utc, a.minutes ORDER BY a.start_utc`,
        [span.meterId, uploadId],
      );
    for (const p of pairs) {
      out.withdrawn += affected(
        await qr.query(
          'DELETE FROM meter_reading WHERE meter_id = ? AND start_utc = ? AND minutes = ? AND upload_id = ?',
          [span.meterId, p.a_start, p.a_minutes, uploadId],
        ),
      );
      if (out.rejections.length < LISTED) {
        out.rejections.push({
          row: 0,
          column: null,
          kind: 'conflict',
          message:
            `meter ${meterRefs.get(span.meterId)}, ${p.a_minutes} min from ` +
            `${utc(p.a_start)}: overlaps a stored ${p.r_minutes}-minute reading ` +
            `from ${utc(p.r_start)} (upload #${p.r_upload}); not stored, ` +
            'so no water is counted twice. Roll back one of the two uploads to keep the other.',
        });
      }
    }
  }
  return out;
}

async function storedSpans(qr: QueryRunner, uploadId: number): Promise<MeterSpan[]> {
  const rows: Array<{ meter_id: number; first: Date; last: Date; lengths: string }> = await qr.query(
    `SELECT meter_id, MIN(start_utc) AS first, MAX(start_utc + INTERVAL minutes MINUTE) AS last,
      GROUP_CONCAT(DISTINCT minutes) AS lengths
     FROM meter_reading WHERE upload_id = ? AND minutes <= ${OVERLAP_MAX_MINUTES} GROUP BY meter_id`,
    [uploadId],
  );
  return rows.map((r) => ({
    meterId: Number(r.meter_id),
    first: r.first,
    last: r.last,
    lengths: String(r.lengths).split(',').map(Number),
  }));
}
