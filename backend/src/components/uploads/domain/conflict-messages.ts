import type { InFileRepeatPolicy, RejectionDto } from '@shared/uploads/upload';
import type { IngestTarget } from '../data/ingest-targets';
import type { MergeOutcome } from '../data/stage-merge';
import type { RepeatGroup, RepeatsOutcome } from '../data/stage-repeats';
import type { IngestRefs } from './ingest-refs';

const utc = (v: unknown) => `${new Date(v as string).toISOString().slice(0, 16).replace('T', ' ')} UTC`;
const num = (v: unknown) => (v === null || v === undefined ? '—' : String(Number(v)));
const day = (v: unknown) => (v instanceof Date ? v.toISOString().slice(0, 10) : String(v).slice(0, 10));

/** Names the stored thing a key points at: a meter's reading, read or bill, or a zone's run. */
function describeKey(target: IngestTarget, key: Record<string, unknown>, meterRefs: Map<number, string>): string {
  switch (target.table) {
    case 'runtime_event':
      return `zone #${key['zone_id']} run at ${utc(key['start_utc'])}`;
    case 'meter_register_read':
      return `meter ${meterRefs.get(Number(key['meter_id']))} read at ${utc(key['read_at'])}`;
    case 'meter_billing_period':
      return `meter ${meterRefs.get(Number(key['meter_id']))}, bill from ${day(key['start_date'])}`;
    default:
      return `meter ${meterRefs.get(Number(key['meter_id']))}, ${key['minutes']} min from ${utc(key['start_utc'])}`;
  }
}

/** The compared values of one row as a person reads them. */
function describeValues(target: IngestTarget, values: Record<string, unknown>): string {
  switch (target.table) {
    case 'runtime_event':
      return `${num(values['minutes'])} min, ${values['cause'] ?? 'no cause'}, ${num(values['measured_gallons'])} gal`;
    case 'meter_register_read':
      return num(values['register_value']);
    case 'meter_billing_period':
      return `${num(values['volume_gal'])} gal to ${day(values['end_date'])}`;
    default:
      return `${num(values['volume_gal'])} gal`;
  }
}

const meterRefsOf = (refs: IngestRefs) => new Map([...refs.meters.values()].map((m) => [m.id, m.ref]));

/** One line per conflict: which reading, what is stored (and from which upload), what the file says, what was done. */
export function conflictRejections(
  target: IngestTarget,
  merged: Pick<MergeOutcome, 'conflicts' | 'conflicting'>,
  refs: IngestRefs,
  outcome: 'replaced' | 'kept' | 'kept-for-later',
): RejectionDto[] {
  const meterRefs = meterRefsOf(refs);
  const done = {
    replaced: 'the stored value was replaced',
    kept: 'the stored value was kept',
    'kept-for-later': 'the stored value was kept (replace it from the upload if the file is right)',
  }[outcome];
  const out: RejectionDto[] = merged.conflicts.map((c) => ({
    row: c.rowNo,
    column: null,
    kind: 'conflict' as const,
    message:
      `${describeKey(target, c.key, meterRefs)}: stored ${describeValues(target, c.stored)} ` +
      `(upload #${c.storedUploadId}), this file ${describeValues(target, c.incoming)}; ${done}.`,
  }));
  if (merged.conflicting > merged.conflicts.length) {
    const more = merged.conflicting - merged.conflicts.length;
    out.push({ row: 0, column: null, kind: 'notice', message: `${more} more conflict(s) not listed.` });
  }
  return out;
}

/** A repeat group's values as a person reads them (the stage gave them `|`-joined, `~` for NULL). */
function groupValues(target: IngestTarget, group: RepeatGroup): string[] {
  return group.values.map((text) => {
    const parts = text.split('|').map((p) => (p === '~' ? null : p));
    return describeValues(target, Object.fromEntries(target.compared.map((c, i) => [c, parts[i]])));
  });
}

const POLICY_DONE: Record<InFileRepeatPolicy, string> = {
  'not-stored': 'not stored; choose keep first, keep last or add them up (on the upload, or when sending it again)',
  'keep-first': "the first row's value was stored, as chosen",
  'keep-last': "the last row's value was stored, as chosen",
  sum: 'the values were added up, as chosen',
};

/** In-file repeats: differing ones named by rows with every value; same-value ones in one notice. */
export function repeatRejections(
  target: IngestTarget,
  repeats: RepeatsOutcome,
  refs: IngestRefs,
  policy: InFileRepeatPolicy,
): RejectionDto[] {
  const meterRefs = meterRefsOf(refs);
  const applied = policy === 'sum' && !target.summable ? 'not-stored' : policy;
  const out: RejectionDto[] = repeats.differing.listed.map((g) => ({
    row: g.rows[0]!,
    column: null,
    kind: 'conflict' as const,
    message:
      `${describeKey(target, g.key, meterRefs)}: the file gives it ${g.rows.length} times with different values ` +
      `(${g.rows.map((row, i) => `row ${row}: ${groupValues(target, g)[i]}`).join('; ')}); ${POLICY_DONE[applied]}.`,
  }));
  if (repeats.differing.groups > repeats.differing.listed.length) {
    const more = repeats.differing.groups - repeats.differing.listed.length;
    out.push({ row: 0, column: null, kind: 'notice', message: `${more} more reading(s) given twice, not listed.` });
  }
  if (repeats.same.groups > 0) {
    const pairs = repeats.same.listed.map((g) => `rows ${g.rows.join(' & ')}`).join(', ');
    const more = repeats.same.groups > repeats.same.listed.length ? ', …' : '';
    out.push({
      row: 0,
      column: null,
      kind: 'notice',
      message:
        `${repeats.same.groups} reading(s) appear more than once in the file with the same value and were ` +
        `stored once: ${pairs}${more}.`,
    });
  }
  return out;
}
