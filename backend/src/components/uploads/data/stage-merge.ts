import type { QueryRunner } from 'typeorm';
import { affected } from './affected';
import type { IngestTarget } from './ingest-targets';
import { STAGE } from './stage-table';

export interface ConflictRow {
  rowNo: number;
  key: Record<string, unknown>;
  stored: Record<string, unknown>;
  incoming: Record<string, unknown>;
  storedUploadId: number;
}

/** Per meter or zone: what the merge did with its staged rows. */
export interface OwnerCounts {
  accepted: number;
  duplicate: number;
  conflicting: number;
}

export interface MergeOutcome {
  accepted: number;
  duplicate: number;
  conflicting: number;
  replaced: number;
  conflicts: ConflictRow[];
  byOwner: Map<number, OwnerCounts>;
}

export interface MergeOptions {
  uploadId: number;
  replaceConflicts: boolean;
  /** Keep the file's value of each conflict for "replace these readings" later (interval readings). */
  keepConflicts: boolean;
  listLimit?: number;
}

/** True when some stored row of a staged meter/zone lies within the staged time span of that meter/zone. */
async function overlapsStored(qr: QueryRunner, t: IngestTarget): Promise<boolean> {
  const [owner, time] = t.key as [string, string];
  const spans: Array<{ id: number; first: Date; last: Date }> = await qr.query(
    `SELECT \`${owner}\` AS id, MIN(\`${time}\`) AS first, MAX(\`${time}\`) AS last FROM ${STAGE}
      GROUP BY \`${owner}\``,
  );
  for (const span of spans) {
    const [hit] = await qr.query(
      `SELECT 1 AS hit FROM \`${t.table}\` WHERE \`${owner}\` = ? AND \`${time}\` BETWEEN ? AND ? LIMIT 1`,
      [span.id, span.first, span.last],
    );
    if (hit) return true;
  }
  return false;
}

/** Staged rows that meet stored ones, per owner: how many, and how many of those are equal. */
async function classify(qr: QueryRunner, t: IngestTarget, on: string, same: string): Promise<Map<number, OwnerCounts>> {
  const staged: Array<{ id: number; n: number }> = await qr.query(
    `SELECT \`${t.owner}\` AS id, COUNT(*) AS n FROM ${STAGE} GROUP BY \`${t.owner}\``,
  );
  const counts = new Map(staged.map((r) => [Number(r.id), { accepted: Number(r.n), duplicate: 0, conflicting: 0 }]));
  // Most uploads bring only new data: when no stored row falls in the file's span for any of its meters/zones,
  // the row-by-row classification cannot match anything and is skipped.
  if (!(await overlapsStored(qr, t))) return counts;
  const matched: Array<{ id: number; matched: number; same: number }> = await qr.query(
    `SELECT s.\`${t.owner}\` AS id, COUNT(*) AS matched, COALESCE(SUM(${same}), 0) AS same
     FROM ${STAGE} s JOIN \`${t.table}\` t ON ${on} GROUP BY s.\`${t.owner}\``,
  );
  for (const m of matched) {
    const c = counts.get(Number(m.id))!;
    c.duplicate = Number(m.same);
    c.conflicting = Number(m.matched) - Number(m.same);
    c.accepted -= Number(m.matched);
  }
  return counts;
}

async function listConflicts(qr: QueryRunner, t: IngestTarget, on: string, same: string, limit: number) {
  const select = [
    's.row_no AS row_no',
    't.upload_id AS stored_upload_id',
    ...t.key.map((k) => `s.\`${k}\` AS \`k_${k}\``),
    ...t.compared.map((c) => `t.\`${c}\` AS \`t_${c}\`, s.\`${c}\` AS \`s_${c}\``),
  ].join(', ');
  const rows: Array<Record<string, unknown>> = await qr.query(
    `SELECT ${select} FROM ${STAGE} s JOIN \`${t.table}\` t ON ${on} WHERE NOT (${same}) ORDER BY s.row_no
      LIMIT ${Number(limit)}`,
  );
  return rows.map((r) => ({
    rowNo: Number(r['row_no']),
    storedUploadId: Number(r['stored_upload_id']),
    key: Object.fromEntries(t.key.map((k) => [k, r[`k_${k}`]])),
    stored: Object.fromEntries(t.compared.map((c) => [c, r[`t_${c}`]])),
    incoming: Object.fromEntries(t.compared.map((c) => [c, r[`s_${c}`]])),
  }));
}

/** Stored rows this upload overwrites are kept in `upload_replacement` first, so roll-back restores them. */
async function replace(qr: QueryRunner, t: IngestTarget, on: string, same: string, uploadId: number) {
  const all = [...t.key, ...t.copied, 'upload_id'];
  const json = all.map((c) => `'${c}', t.\`${c}\``).join(', ');
  await qr.query(
    `INSERT INTO upload_replacement (upload_id, target_table, previous_row) SELECT ?, '${t.table}',
      JSON_OBJECT(${json}) FROM ${STAGE} s JOIN \`${t.table}\` t ON ${on} WHERE NOT (${same})`,
    [uploadId],
  );
  const set = [...t.copied.map((c) => `t.\`${c}\` = s.\`${c}\``), 't.upload_id = ?'].join(', ');
  return affected(
    await qr.query(`UPDATE \`${t.table}\` t JOIN ${STAGE} s ON ${on} SET ${set} WHERE NOT (${same})`, [uploadId]),
  );
}

/** The file's values of conflicting interval readings, kept for "replace these readings" after the upload. */
async function keepConflicts(qr: QueryRunner, on: string, same: string, uploadId: number): Promise<void> {
  await qr.query(
    `INSERT INTO upload_conflict (upload_id, kind, meter_id, start_utc, minutes, volume_gal, original_value,
      original_unit, flags, row_no) SELECT ?, 'stored', s.meter_id, s.start_utc, s.minutes, s.volume_gal,
      s.original_value, s.original_unit, s.flags, s.row_no FROM ${STAGE} s JOIN meter_reading t ON ${on}
      WHERE NOT (${same})`,
    [uploadId],
  );
}

/**
 * Classifies staged rows against stored ones and writes: new rows are inserted; rows equal to stored ones are
 * duplicates; rows differing are conflicts — listed (first `listLimit`), and replaced only when asked (else, for
 * interval readings, kept for a later "replace"). Runs in the caller's transaction.
 */
export async function mergeStage(qr: QueryRunner, t: IngestTarget, options: MergeOptions): Promise<MergeOutcome> {
  const on = t.key.map((k) => `t.\`${k}\` = s.\`${k}\``).join(' AND ');
  const same = t.compared.map((c) => `t.\`${c}\` <=> s.\`${c}\``).join(' AND ');
  const byOwner = await classify(qr, t, on, same);
  const total = (field: keyof OwnerCounts) => [...byOwner.values()].reduce((sum, c) => sum + c[field], 0);
  const conflicting = total('conflicting');
  let conflicts: ConflictRow[] = [];
  let replaced = 0;
  if (conflicting > 0) {
    conflicts = await listConflicts(qr, t, on, same, options.listLimit ?? 1000);
    if (options.replaceConflicts) replaced = await replace(qr, t, on, same, options.uploadId);
    else if (options.keepConflicts && t.table === 'meter_reading') await keepConflicts(qr, on, same, options.uploadId);
  }
  const columns = [...t.key, ...t.copied].map((c) => `\`${c}\``).join(', ');
  // IGNORE skips the keys classified above; the stage's types equal the target's, so nothing else is ignored.
  const inserted = await qr.query(
    `INSERT IGNORE INTO \`${t.table}\` (${columns}, upload_id) SELECT ${columns}, ? FROM ${STAGE}`,
    [options.uploadId],
  );
  return {
    accepted: affected(inserted),
    duplicate: total('duplicate'),
    conflicting,
    replaced,
    conflicts,
    byOwner,
  };
}
