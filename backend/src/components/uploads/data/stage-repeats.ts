import type { QueryRunner } from 'typeorm';
import type { InFileRepeatPolicy } from '@shared/uploads/upload';
import type { IngestTarget } from './ingest-targets';
import { STAGE } from './stage-table';

const REPEAT = 'ingest_repeat';

/** One reading the file gives more than once: its key, the file rows, and each row's compared values. */
export interface RepeatGroup {
  ownerId: number;
  key: Record<string, unknown>;
  rows: number[];
  values: string[];
}

export interface RepeatsOutcome {
  /** Same values more than once: stored once. `extraRows` is how many rows were dropped. */
  same: { groups: number; extraRows: number; listed: RepeatGroup[]; byOwner: Map<number, number> };
  /** Different values: stored only as the policy says. */
  differing: { groups: number; listed: RepeatGroup[]; byOwner: Map<number, number>; stored: number };
}

const none = (): RepeatsOutcome => ({
  same: { groups: 0, extraRows: 0, listed: [], byOwner: new Map() },
  differing: { groups: 0, listed: [], byOwner: new Map(), stored: 0 },
});

/**
 * Finds the readings (runs, reads, periods) the staged file gives more than once and leaves one row for each in the
 * stage, or none: same values → the first row; different values → as `policy` says (`not-stored` drops them all;
 * `sum` applies to interval volumes only, elsewhere it is `not-stored`). With `keepFor` the differing rows are also
 * kept in `upload_conflict`, so a person can still choose after the upload.
 */
export async function resolveStageRepeats(
  qr: QueryRunner,
  target: IngestTarget,
  options: { policy: InFileRepeatPolicy; keepFor?: number; listLimit: number },
): Promise<RepeatsOutcome> {
  const key = target.key.map((k) => `\`${k}\``).join(', ');
  const on = target.key.map((k) => `r.\`${k}\` = s.\`${k}\``).join(' AND ');
  const text = `CONCAT_WS('|', ${target.compared.map((c) => `IFNULL(s.\`${c}\`, '~')`).join(', ')})`;
  const sums = target.summable
    ? `, SUM(s.\`${target.summable.gallons}\`) AS sum_gal, SUM(s.\`${target.summable.original}\`) AS sum_value,
       COUNT(DISTINCT s.\`${target.summable.unit}\`) AS units`
    : '';
  await qr.query(`DROP TEMPORARY TABLE IF EXISTS ${REPEAT}`);
  await qr.query(
    `CREATE TEMPORARY TABLE ${REPEAT} ENGINE=InnoDB AS SELECT ${target.key.map((k) => `s.\`${k}\``).join(', ')},
      COUNT(*) AS n, MIN(s.row_no) AS first_row, MAX(s.row_no) AS last_row, COUNT(DISTINCT ${text}) AS variants
      ${sums} FROM ${STAGE} s GROUP BY ${key} HAVING COUNT(*) > 1`,
  );
  const out = none();
  try {
    const [{ groups }] = await qr.query(`SELECT COUNT(*) AS groups FROM ${REPEAT}`);
    if (Number(groups) === 0) return out;
    await tally(qr, target, out);
    out.same.listed = await listGroups(qr, target, { on, text, differing: false, limit: 50 });
    out.differing.listed = await listGroups(qr, target, { on, text, differing: true, limit: options.listLimit });
    if (options.keepFor !== undefined && target.table === 'meter_reading') await keepForLater(qr, on, options.keepFor);
    await qr.query(
      `DELETE s FROM ${STAGE} s JOIN ${REPEAT} r ON ${on} WHERE r.variants = 1 AND s.row_no <> r.first_row`,
    );
    out.differing.stored = await applyPolicy(qr, target, on, options.policy);
    return out;
  } finally {
    await qr.query(`DROP TEMPORARY TABLE IF EXISTS ${REPEAT}`);
  }
}

async function tally(qr: QueryRunner, target: IngestTarget, out: RepeatsOutcome): Promise<void> {
  const rows: Array<{ id: number; same_groups: number; extra: number; differing: number }> = await qr.query(
    `SELECT \`${target.owner}\` AS id, SUM(variants = 1) AS same_groups, SUM(IF(variants = 1, n - 1, 0)) AS extra,
      SUM(variants > 1) AS differing FROM ${REPEAT} GROUP BY \`${target.owner}\``,
  );
  for (const r of rows) {
    const [sameGroups, extra, differing] = [Number(r.same_groups), Number(r.extra), Number(r.differing)];
    out.same.groups += sameGroups;
    out.same.extraRows += extra;
    out.differing.groups += differing;
    if (extra) out.same.byOwner.set(Number(r.id), extra);
    if (differing) out.differing.byOwner.set(Number(r.id), differing);
  }
}

async function listGroups(
  qr: QueryRunner,
  target: IngestTarget,
  q: { on: string; text: string; differing: boolean; limit: number },
): Promise<RepeatGroup[]> {
  const keys = target.key.map((k) => `r.\`${k}\` AS \`k_${k}\``).join(', ');
  const rows: Array<Record<string, unknown>> = await qr.query(
    `SELECT ${keys}, GROUP_CONCAT(s.row_no ORDER BY s.row_no) AS row_list,
      GROUP_CONCAT(${q.text} ORDER BY s.row_no SEPARATOR ';') AS value_list
     FROM ${REPEAT} r JOIN ${STAGE} s ON ${q.on} WHERE r.variants ${q.differing ? '>' : '='} 1
     GROUP BY ${target.key.map((k) => `r.\`${k}\``).join(', ')} ORDER BY MIN(s.row_no) LIMIT ${Number(q.limit)}`,
  );
  return rows.map((r) => ({
    ownerId: Number(r[`k_${target.owner}`]),
    key: Object.fromEntries(target.key.map((k) => [k, r[`k_${k}`]])),
    rows: String(r['row_list']).split(',').map(Number),
    values: String(r['value_list']).split(';'),
  }));
}

/** The differing rows go to `upload_conflict` (interval readings), for a choice after the upload. */
async function keepForLater(qr: QueryRunner, on: string, uploadId: number): Promise<void> {
  await qr.query(
    `INSERT INTO upload_conflict (upload_id, kind, meter_id, start_utc, minutes, volume_gal, original_value,
      original_unit, flags, row_no) SELECT ?, 'in-file', s.meter_id, s.start_utc, s.minutes, s.volume_gal,
      s.original_value, s.original_unit, s.flags, s.row_no FROM ${STAGE} s JOIN ${REPEAT} r ON ${on}
      WHERE r.variants > 1`,
    [uploadId],
  );
}

/** Leaves the row the policy keeps for each differing reading (none for `not-stored`); returns how many kept. */
async function applyPolicy(
  qr: QueryRunner,
  target: IngestTarget,
  on: string,
  policy: InFileRepeatPolicy,
): Promise<number> {
  const differing = `FROM ${STAGE} s JOIN ${REPEAT} r ON ${on} WHERE r.variants > 1`;
  const sum = target.summable;
  if (policy === 'keep-first' || policy === 'keep-last' || (policy === 'sum' && sum)) {
    if (policy === 'sum' && sum) {
      await qr.query(
        `UPDATE ${STAGE} s JOIN ${REPEAT} r ON ${on} AND s.row_no = r.first_row SET s.\`${sum.gallons}\` =
          r.sum_gal, s.\`${sum.original}\` = IF(r.units = 1, r.sum_value, r.sum_gal), s.\`${sum.unit}\` =
          IF(r.units = 1, s.\`${sum.unit}\`, 'gal') WHERE r.variants > 1`,
      );
    }
    const kept = policy === 'keep-last' ? 'r.last_row' : 'r.first_row';
    await qr.query(`DELETE s ${differing} AND s.row_no <> ${kept}`);
    const [{ n }] = await qr.query(`SELECT COUNT(*) AS n FROM ${REPEAT} WHERE variants > 1`);
    return Number(n);
  }
  await qr.query(`DELETE s ${differing}`);
  return 0;
}
