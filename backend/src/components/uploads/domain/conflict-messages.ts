import type { RejectionDto } from '@shared/uploads/upload';
import type { IngestTarget } from '../data/ingest-targets';
import type { MergeOutcome } from '../data/ingest-writer';
import type { IngestRefs } from './ingest-refs';

const utc = (v: unknown) => `${new Date(v as string).toISOString().slice(0, 16).replace('T', ' ')} UTC`;
const num = (v: unknown) => (v === null || v === undefined ? '—' : String(Number(v)));

/** One line per conflict: which reading, what is stored (and from which upload), what the file says, what was done. */
export function conflictRejections(
  target: IngestTarget,
  merged: MergeOutcome,
  refs: IngestRefs,
  replaced: boolean,
): RejectionDto[] {
  const meterRefs = new Map([...refs.meters.values()].map((m) => [m.id, m.ref]));
  const outcome = replaced ? 'the stored value was replaced' : 'the stored value was kept';
  const out: RejectionDto[] = merged.conflicts.map((c) => {
    let what: string;
    let stored: string;
    let incoming: string;
    if (target.table === 'runtime_event') {
      what = `zone #${c.key['zone_id']} run at ${utc(c.key['start_utc'])}`;
      stored =
        `${num(c.stored['minutes'])} min, ${c.stored['cause'] ?? 'no cause'}, ` +
        `${num(c.stored['measured_gallons'])} gal`;
      incoming =
        `${num(c.incoming['minutes'])} min, ${c.incoming['cause'] ?? 'no cause'}, ` +
        `${num(c.incoming['measured_gallons'])} gal`;
    } else if (target.table === 'meter_register_read') {
      what = `meter ${meterRefs.get(Number(c.key['meter_id']))} read at ${utc(c.key['read_at'])}`;
      stored = num(c.stored['register_value']);
      incoming = num(c.incoming['register_value']);
    } else {
      what =
        `meter ${meterRefs.get(Number(c.key['meter_id']))}, ${c.key['minutes']} ` +
        `min from ${utc(c.key['start_utc'])}`;
      stored = `${num(c.stored['volume_gal'])} gal`;
      incoming = `${num(c.incoming['volume_gal'])} gal`;
    }
    return {
      row: c.rowNo,
      column: null,
      kind: 'conflict' as const,
      message: `${what}: stored ${stored} (upload #${c.storedUploadId}), this file ${incoming}; ${outcome}.`,
    };
  });
  if (merged.conflicting > merged.conflicts.length) {
    out.push({
      row: 0,
      column: null,
      kind: 'notice',
      message: `${merged.conflicting - merged.conflicts.length} more conflict(s) not listed.`,
    });
  }
  return out;
}
