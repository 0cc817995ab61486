import type { EntityManager } from 'typeorm';
import type { ConflictDayDto, RepeatChoice } from '@shared/uploads/upload';
import { affected } from './affected';

/** Conflicts to act on: all of an upload's open ones, or those of one site's local day. */
export interface ConflictScope {
  uploadId: number;
  kind: 'stored' | 'in-file';
  day?: { siteId: number; date: string };
}

export interface SiteSpan {
  siteId: number;
  from: Date;
  to: Date;
}

const KEY = 't.meter_id = c.meter_id AND t.start_utc = c.start_utc AND t.minutes = c.minutes';
const LOCAL_DAY = "DATE(CONVERT_TZ(c.start_utc, '+00:00', s.time_zone))";
const dateOnly = (v: unknown) => (v instanceof Date ? v.toISOString().slice(0, 10) : String(v).slice(0, 10));

function where(scope: ConflictScope): { sql: string; params: unknown[] } {
  let sql = 'c.upload_id = ? AND c.kind = ? AND c.resolved = 0';
  const params: unknown[] = [scope.uploadId, scope.kind];
  if (scope.day) {
    sql += ` AND m.site_id = ? AND ${LOCAL_DAY} = ?`;
    params.push(scope.day.siteId, scope.day.date);
  }
  return { sql, params };
}

const FROM = 'upload_conflict c JOIN meter m ON m.id = c.meter_id JOIN site s ON s.id = m.site_id';

/** Interval readings an upload left undecided (`upload_conflict`), and acting on them after the fact. */
export class ConflictsRepository {
  /** Open conflicts per site and local day: readings, stored total and the file's total. */
  async days(em: EntityManager, uploadId: number): Promise<ConflictDayDto[]> {
    const stored: Array<Record<string, unknown>> = await em.query(
      `SELECT ${LOCAL_DAY} AS d, m.site_id, COUNT(*) AS n, SUM(t.volume_gal) AS stored, SUM(c.volume_gal) AS file
       FROM ${FROM} LEFT JOIN meter_reading t ON ${KEY}
       WHERE c.upload_id = ? AND c.kind = 'stored' AND c.resolved = 0 GROUP BY d, m.site_id`,
      [uploadId],
    );
    const inFile: Array<Record<string, unknown>> = await em.query(
      `SELECT ${LOCAL_DAY} AS d, m.site_id, COUNT(DISTINCT c.meter_id, c.start_utc, c.minutes) AS n,
        SUM(IF(c.row_no = f.first_row, c.volume_gal, 0)) AS file
       FROM ${FROM} JOIN (SELECT meter_id, start_utc, minutes, MIN(row_no) AS first_row FROM upload_conflict
         WHERE upload_id = ? AND kind = 'in-file' AND resolved = 0 GROUP BY meter_id, start_utc, minutes) f
         ON f.meter_id = c.meter_id AND f.start_utc = c.start_utc AND f.minutes = c.minutes
       WHERE c.upload_id = ? AND c.kind = 'in-file' AND c.resolved = 0 GROUP BY d, m.site_id`,
      [uploadId, uploadId],
    );
    const day = (kind: 'stored' | 'in-file') => (r: Record<string, unknown>) => ({
      date: dateOnly(r['d']),
      siteId: Number(r['site_id']),
      kind,
      readings: Number(r['n']),
      storedGallons: kind === 'stored' ? Number(r['stored'] ?? 0) : null,
      fileGallons: Number(r['file']),
    });
    return [...stored.map(day('stored')), ...inFile.map(day('in-file'))].sort(
      (a, b) => a.date.localeCompare(b.date) || a.siteId - b.siteId || a.kind.localeCompare(b.kind),
    );
  }

  /** Open readings of each kind. */
  async open(em: EntityManager, uploadId: number): Promise<{ stored: number; inFile: number }> {
    const [row] = await em.query(
      `SELECT COALESCE(SUM(kind = 'stored'), 0) AS stored, COUNT(DISTINCT IF(kind = 'in-file',
        CONCAT(meter_id, '|', start_utc, '|', minutes), NULL)) AS in_file
       FROM upload_conflict WHERE upload_id = ? AND resolved = 0`,
      [uploadId],
    );
    return { stored: Number(row.stored), inFile: Number(row.in_file) };
  }

  /** The sites and time span the scope covers (for the daily rollups). */
  async spans(em: EntityManager, scope: ConflictScope): Promise<SiteSpan[]> {
    const w = where(scope);
    const rows: Array<Record<string, unknown>> = await em.query(
      `SELECT m.site_id, MIN(c.start_utc) AS first, MAX(c.start_utc) AS last FROM ${FROM} WHERE ${w.sql}
       GROUP BY m.site_id`,
      w.params,
    );
    return rows.map((r) => ({
      siteId: Number(r['site_id']),
      from: new Date(r['first'] as string),
      to: new Date(r['last'] as string),
    }));
  }

  /**
   * Writes the file's values over the stored ones (kept in `upload_replacement` for roll-back; a reading whose
   * stored row has gone since is inserted), and marks the conflicts done. Returns the readings replaced.
   */
  async replace(em: EntityManager, scope: ConflictScope): Promise<number> {
    const w = where({ ...scope, kind: 'stored' });
    const id = scope.uploadId;
    await em.query(
      `INSERT INTO upload_replacement (upload_id, target_table, previous_row) SELECT ?, 'meter_reading',
        JSON_OBJECT('meter_id', t.meter_id, 'start_utc', t.start_utc, 'minutes', t.minutes, 'volume_gal',
        t.volume_gal, 'original_value', t.original_value, 'original_unit', t.original_unit, 'flags', t.flags,
        'upload_id', t.upload_id) FROM ${FROM} JOIN meter_reading t ON ${KEY} WHERE ${w.sql}`,
      [id, ...w.params],
    );
    await em.query(
      `UPDATE meter_reading t JOIN ${FROM} ON ${KEY} SET t.volume_gal = c.volume_gal, t.original_value =
        c.original_value, t.original_unit = c.original_unit, t.flags = c.flags, t.upload_id = ? WHERE ${w.sql}`,
      [id, ...w.params],
    );
    await em.query(
      `INSERT IGNORE INTO meter_reading (meter_id, start_utc, minutes, volume_gal, original_value, original_unit,
        flags, upload_id) SELECT c.meter_id, c.start_utc, c.minutes, c.volume_gal, c.original_value,
        c.original_unit, c.flags, ? FROM ${FROM} WHERE ${w.sql}`,
      [id, ...w.params],
    );
    return affected(await em.query(`UPDATE ${FROM} SET c.resolved = 1 WHERE ${w.sql}`, w.params));
  }

  /** Stores one value for each reading the file gave twice, as chosen; returns the readings stored. */
  async resolveRepeats(em: EntityManager, uploadId: number, choice: RepeatChoice): Promise<number> {
    const open = `upload_id = ? AND kind = 'in-file' AND resolved = 0`;
    const columns = 'meter_id, start_utc, minutes, volume_gal, original_value, original_unit, flags, upload_id';
    let select: string;
    if (choice === 'sum') {
      select = `SELECT meter_id, start_utc, minutes, SUM(volume_gal), IF(COUNT(DISTINCT original_unit) = 1,
        SUM(original_value), SUM(volume_gal)), IF(COUNT(DISTINCT original_unit) = 1, MIN(original_unit), 'gal'),
        MAX(flags), ? FROM upload_conflict WHERE ${open} GROUP BY meter_id, start_utc, minutes`;
    } else {
      const pick = choice === 'keep-last' ? 'MAX(row_no)' : 'MIN(row_no)';
      select = `SELECT c.meter_id, c.start_utc, c.minutes, c.volume_gal, c.original_value, c.original_unit,
        c.flags, ? FROM upload_conflict c JOIN (SELECT meter_id, start_utc, minutes, ${pick} AS pick FROM
        upload_conflict WHERE ${open} GROUP BY meter_id, start_utc, minutes) p ON p.meter_id = c.meter_id AND
        p.start_utc = c.start_utc AND p.minutes = c.minutes AND p.pick = c.row_no WHERE c.upload_id = ? AND
        c.kind = 'in-file'`;
    }
    const params = choice === 'sum' ? [uploadId, uploadId] : [uploadId, uploadId, uploadId];
    const stored = affected(await em.query(`INSERT IGNORE INTO meter_reading (${columns}) ${select}`, params));
    await em.query(`UPDATE upload_conflict SET resolved = 1 WHERE ${open}`, [uploadId]);
    return stored;
  }
}
