import type { QueryRunner } from 'typeorm';
import type { InFileRepeatPolicy, RejectionDto } from '@shared/uploads/upload';
import type { BillingPeriodsRepository } from '../../data/billing-periods-repository';
import { INTERVAL_TARGET } from '../../data/ingest-targets';
import { OVERLAP_MAX_MINUTES, type IntervalOverlapsRepository } from '../../data/interval-overlaps-repository';
import type { RegisterReadsRepository } from '../../data/register-reads-repository';
import { mergeStage, type OwnerCounts } from '../../data/stage-merge';
import { resolveStageRepeats } from '../../data/stage-repeats';
import { spreadBillingPeriods, type DailyEto } from '../billing-periods';
import { conflictRejections, repeatRejections } from '../conflict-messages';
import type { IngestRefs } from '../ingest-refs';
import { withdrawLengthOverlaps } from '../interval-overlaps';
import { deriveRegisterVolumes, type RecordSwap } from '../register-volumes';
import { IMPORT_ISOLATION, type Staged } from './stage';

export interface MergeDeps {
  overlaps: IntervalOverlapsRepository;
  registerReads: RegisterReadsRepository;
  billing: BillingPeriodsRepository;
  recordSwap: RecordSwap;
  dailyEto: DailyEto;
}

export interface MergeInput {
  uploadId: number;
  refs: IngestRefs;
  replaceConflicts: boolean;
  repeats: InFileRepeatPolicy;
  zoneOfSite: (siteId: number) => string;
}

export interface Merged {
  accepted: number;
  duplicate: number;
  conflicting: number;
  replaced: number;
  /** Register reads that could not be differenced (negative steps…), counted as rejected. */
  problems: number;
  /** Per meter or zone. */
  byOwner: Map<number, OwnerCounts>;
  rejections: RejectionDto[];
}

const emptyCounts = (): OwnerCounts => ({ accepted: 0, duplicate: 0, conflicting: 0 });

function owner(merged: Merged, id: number): OwnerCounts {
  let c = merged.byOwner.get(id);
  if (!c) merged.byOwner.set(id, (c = emptyCounts()));
  return c;
}

/** Moves `n` of an owner's readings from accepted to conflicting (taken out again as double counting). */
function withdraw(merged: Merged, id: number, n: number): void {
  owner(merged, id).accepted -= n;
  owner(merged, id).conflicting += n;
  merged.accepted -= n;
  merged.conflicting += n;
}

/** A direct load stored every line: its counts are the lines sent, per meter. */
function directMerge(staged: Staged): Merged {
  const byOwner = new Map<number, OwnerCounts>();
  for (const [meterId, n] of staged.spans!.countsByMeter()) byOwner.set(meterId, { ...emptyCounts(), accepted: n });
  return { accepted: staged.staged, duplicate: 0, conflicting: 0, replaced: 0, problems: 0, byOwner, rejections: [] };
}

/** Repeats inside the file, then the stage against stored data. */
async function stageMerge(qr: QueryRunner, staged: Staged, input: MergeInput): Promise<Merged> {
  await qr.startTransaction(IMPORT_ISOLATION);
  const target = staged.target;
  const interval = target === INTERVAL_TARGET;
  const repeats = await resolveStageRepeats(qr, target, {
    policy: input.repeats,
    keepFor: interval && input.repeats === 'not-stored' ? input.uploadId : undefined,
    listLimit: 1000,
  });
  const replace = input.replaceConflicts && target.table !== 'meter_billing_period';
  const merged = await mergeStage(qr, target, {
    uploadId: input.uploadId,
    replaceConflicts: replace,
    keepConflicts: interval,
  });
  const out: Merged = {
    accepted: merged.accepted,
    duplicate: merged.duplicate + repeats.same.extraRows,
    conflicting: merged.conflicting + repeats.differing.groups,
    replaced: merged.replaced,
    problems: 0,
    byOwner: merged.byOwner,
    rejections: repeatRejections(target, repeats, input.refs, input.repeats),
  };
  for (const [id, n] of repeats.same.byOwner) owner(out, id).duplicate += n;
  for (const [id, n] of repeats.differing.byOwner) owner(out, id).conflicting += n;
  const outcome = replace ? 'replaced' : interval ? 'kept-for-later' : 'kept';
  out.rejections.push(...conflictRejections(target, merged, input.refs, outcome));
  return out;
}

/**
 * Merge: the staged file against stored data, in the upload's transaction (already open after a direct load):
 * repeats inside the file resolved, new rows stored, duplicates left, conflicts listed (replaced, or kept for a
 * later choice); then what each kind needs after that — readings of another length taken out again (no water
 * counted twice), register reads differenced into volumes (swaps recorded), bills spread over their days.
 */
export async function mergeStaged(
  qr: QueryRunner,
  staged: Staged,
  input: MergeInput,
  deps: MergeDeps,
): Promise<Merged> {
  const merged = staged.direct ? directMerge(staged) : await stageMerge(qr, staged, input);
  const em = qr.manager;
  if (staged.target === INTERVAL_TARGET && merged.accepted > 0) {
    // After a direct load every line sent was stored: the spans collected while sending are exact.
    const known = staged.direct ? staged.spans?.meterSpans(OVERLAP_MAX_MINUTES) : undefined;
    const overlaps = await withdrawLengthOverlaps(em, deps.overlaps, {
      uploadId: input.uploadId,
      refs: input.refs,
      known,
    });
    for (const [meterId, n] of overlaps.byMeter) withdraw(merged, meterId, n);
    merged.rejections.push(...overlaps.rejections);
  }
  if (staged.kind === 'register') {
    const derived = await deriveRegisterVolumes(em, {
      uploadId: input.uploadId,
      refs: input.refs,
      table: staged.table,
      repo: deps.registerReads,
      recordSwap: deps.recordSwap,
    });
    merged.rejections.push(...derived.rejections);
    merged.problems += derived.problems;
  }
  if (staged.kind === 'billing') {
    const spread = await spreadBillingPeriods(em, {
      uploadId: input.uploadId,
      refs: input.refs,
      zoneOfSite: input.zoneOfSite,
      periods: deps.billing,
      volumes: deps.registerReads,
      dailyEto: deps.dailyEto,
    });
    for (const [meterId, n] of spread.refusedByMeter) withdraw(merged, meterId, n);
    merged.rejections.push(...spread.rejections);
  }
  return merged;
}
