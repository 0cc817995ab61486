import type { EntityManager } from 'typeorm';
import { affected } from './affected';

/** Only readings up to a (25-hour) day long are compared; register-derived volumes are longer. */
export const OVERLAP_MAX_MINUTES = 1500;

export interface MeterSpan {
  meterId: number;
  /** Earliest start. */
  first: Date;
  /** Latest end (start + minutes). */
  last: Date;
  lengths: number[];
}

export interface OverlapPair {
  start: Date;
  minutes: number;
  otherStart: Date;
  otherMinutes: number;
  otherUpload: number;
}

/** The SQL behind "one meter, overlapping time, another interval length" (see `interval-overlaps.ts`). */
export class IntervalOverlapsRepository {
  /** The spans of what an upload stored, per meter (when they were not collected while sending). */
  async storedSpans(em: EntityManager, uploadId: number): Promise<MeterSpan[]> {
    const rows: Array<{ meter_id: number; first: Date; last: Date; lengths: string }> = await em.query(
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

  /** Cheap test first: any other upload's reading of another length in this meter's span at all? */
  async anyOtherLength(em: EntityManager, span: MeterSpan, uploadId: number): Promise<boolean> {
    const [hit] = await em.query(
      `SELECT 1 AS hit FROM meter_reading WHERE meter_id = ? AND start_utc >= ? - INTERVAL ${OVERLAP_MAX_MINUTES}
        MINUTE AND start_utc < ? AND upload_id <> ? AND minutes <= ${OVERLAP_MAX_MINUTES} AND minutes NOT IN (?)
        LIMIT 1`,
      [span.meterId, span.first, span.last, uploadId, span.lengths],
    );
    return !!hit;
  }

  /** This upload's readings of one meter that overlap another upload's reading of another length. */
  async overlaps(em: EntityManager, meterId: number, uploadId: number): Promise<OverlapPair[]> {
    const rows: Array<{ a_start: Date; a_minutes: number; r_start: Date; r_minutes: number; r_upload: number }> =
      await em.query(
        `SELECT a.start_utc AS a_start, a.minutes AS a_minutes, MIN(r.start_utc) AS r_start,
          MIN(r.minutes) AS r_minutes, MIN(r.upload_id) AS r_upload
         FROM meter_reading a JOIN meter_reading r ON r.meter_id = a.meter_id
           AND r.start_utc >= a.start_utc - INTERVAL ${OVERLAP_MAX_MINUTES} MINUTE
           AND r.start_utc < a.start_utc + INTERVAL a.minutes MINUTE
           AND r.start_utc + INTERVAL r.minutes MINUTE > a.start_utc
           AND r.upload_id <> a.upload_id AND r.minutes <> a.minutes AND r.minutes <= ${OVERLAP_MAX_MINUTES}
         WHERE a.meter_id = ? AND a.upload_id = ? AND a.minutes <= ${OVERLAP_MAX_MINUTES}
         GROUP BY a.start_utc, a.minutes ORDER BY a.start_utc`,
        [meterId, uploadId],
      );
    return rows.map((r) => ({
      start: r.a_start,
      minutes: Number(r.a_minutes),
      otherStart: r.r_start,
      otherMinutes: Number(r.r_minutes),
      otherUpload: Number(r.r_upload),
    }));
  }

  /** Takes one reading this upload stored out again; 1 when it was there. */
  async withdraw(em: EntityManager, meterId: number, pair: OverlapPair, uploadId: number): Promise<number> {
    return affected(
      await em.query(
        'DELETE FROM meter_reading WHERE meter_id = ? AND start_utc = ? AND minutes = ? AND upload_id = ?',
        [meterId, pair.start, pair.minutes, uploadId],
      ),
    );
  }
}
