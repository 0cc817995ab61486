import type { EntityManager } from 'typeorm';
import { differenceRegisterReads, serialSwaps, type SerialSwap } from '@shared/ingest/register-differencing';
import { READING_FLAGS } from '@shared/readings/reading-flags';
import { toGallons } from '@shared/units/volume-units';
import type { RejectionDto } from '@shared/uploads/upload';
import { sqlUtc } from '../data/ingest-targets';
import type { DerivedVolume, RegisterReadsRepository, StoredRead } from '../data/register-reads-repository';
import type { StageTable } from '../data/stage-table';
import type { IngestMeter, IngestRefs } from './ingest-refs';

/** Records a swap an upload saw (meters' domain service, inside the upload's transaction). */
export type RecordSwap = (
  em: EntityManager,
  meterId: number,
  swap: { at: Date; multiplier: number | null; digits: number | null; oldSerial: string; uploadId: number },
) => Promise<void>;

export interface RegisterVolumesInput {
  uploadId: number;
  refs: IngestRefs;
  table: StageTable;
  repo: RegisterReadsRepository;
  recordSwap: RecordSwap;
}

export interface RegisterVolumes {
  volumes: number;
  problems: number;
  swaps: number;
  rejections: RejectionDto[];
}

const when = (iso: string) => `${iso.slice(0, 16).replace('T', ' ')} UTC`;

/** A serial change this upload brought that no register period of the meter marks yet. */
function isNewSwap(meter: IngestMeter, swap: SerialSwap, reads: StoredRead[], uploadId: number): boolean {
  const mine = reads.some((r) => r.atUtc === swap.initialReadUtc && r.uploadId === uploadId);
  const known = meter.registers.some((p) => p.installedUtc === swap.initialReadUtc);
  return mine && !known;
}

/** First file row of each of this file's read instants, for messages. */
async function fileRows(table: StageTable, meterId: number): Promise<Map<string, number>> {
  const rows = new Map<string, number>();
  for (const s of await table.stagedRows('meter_id = ? ORDER BY row_no', [meterId])) {
    const at = new Date(s['read_at'] as Date).toISOString();
    if (!rows.has(at)) rows.set(at, Number(s['row_no']));
  }
  return rows;
}

/**
 * After an upload's register reads are stored: differences every touched meter's reads (stored and new together,
 * so a monthly file continues last month's) into interval volumes, stored with this upload. A serial change the
 * file shows is a meter swap: each serial is differenced on its own (usage across the swap counted once) and the
 * swap is recorded as a register period of the meter. Problems on this upload's reads are reported.
 */
export async function deriveRegisterVolumes(em: EntityManager, input: RegisterVolumesInput): Promise<RegisterVolumes> {
  const byId = new Map([...input.refs.meters.values()].map((m) => [m.id, m]));
  const out: RegisterVolumes = { volumes: 0, problems: 0, swaps: 0, rejections: [] };
  let rollovers = 0;
  for (const meterId of await input.table.distinct('meter_id')) {
    const meter = byId.get(meterId)!;
    const reads = await input.repo.reads(em, meterId, meter.ref);
    const rows = await fileRows(input.table, meterId);
    const result = differenceRegisterReads({ meterRef: meter.ref, registers: meter.registers }, reads);
    rollovers += result.rollovers.length;
    for (const p of result.problems) {
      const row = rows.get(p.atUtc);
      if (row === undefined) continue; // a problem between earlier uploads' reads was reported then
      if (p.severity === 'error') out.problems++;
      out.rejections.push({
        row,
        column: null,
        kind: p.severity === 'error' ? 'rejected' : 'notice',
        message: `${meter.ref} at ${when(p.atUtc)}: ${p.message}`,
      });
    }
    for (const swap of serialSwaps(reads).filter((s) => isNewSwap(meter, s, reads, input.uploadId))) {
      await input.recordSwap(em, meterId, {
        at: new Date(swap.initialReadUtc),
        multiplier: swap.initial.multiplier ?? null,
        digits: swap.initial.digits ?? null,
        oldSerial: swap.fromSerial,
        uploadId: input.uploadId,
      });
      out.swaps++;
      out.rejections.push({
        row: rows.get(swap.initialReadUtc) ?? 0,
        column: null,
        kind: 'notice',
        message:
          `${meter.ref}: serial ${swap.fromSerial} (final read ${when(swap.finalReadUtc)}) was replaced by ` +
          `${swap.toSerial} (initial read ${when(swap.initialReadUtc)}); the swap is recorded on the meter.`,
      });
    }
    const volumes: DerivedVolume[] = result.volumes.map((v) => ({
      meterId,
      startSql: sqlUtc(v.startUtc),
      minutes: v.minutes,
      gallons: toGallons(v.volume, v.unit),
      original: v.volume,
      unit: v.unit,
      flags: v.estimated ? READING_FLAGS.estimated : 0,
    }));
    out.volumes += await input.repo.insertVolumes(em, input.uploadId, volumes);
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
