/**
 * Cumulative register reads of one meter → interval volumes between consecutive reads.
 * - Rollover: a register with d digits wraps at 10^d, so 9,998 → 0,003 on 4 digits is 5 units. A negative
 *   difference counts as a rollover only when the wrapped usage is under half the dial's range; otherwise it is
 *   more likely a misread or a reset, and is reported rather than turned into a huge volume. After a reported
 *   drop, the newer read becomes the base (the latest read is the one a field check confirms).
 * - Meter swaps: each physical register has an install (and removal) time; two reads on different registers are
 *   never differenced. A read exactly at the swap instant may be both the old meter's final and the new one's
 *   initial read: the first such read goes to the old register, the next to the new.
 * - Multiplier: register units × multiplier = volume in the read's unit (e.g. a ×10 dial).
 */
import type { IntervalRecord, RegisterRecord } from './ingest-records';

export interface RegisterPeriod {
  installedUtc: string;
  /** `null` while still installed. */
  removedUtc: string | null;
  multiplier: number;
  /** Whole-number digits on the dial, for rollover; `null` when unknown (then no rollover is assumed). */
  digits: number | null;
}

export interface MeterRegisterFacts {
  meterRef: string;
  registers: RegisterPeriod[];
}

export type RegisterProblemKind =
  | 'other-meter'
  | 'not-sorted'
  | 'duplicate'
  | 'outside-install'
  | 'too-many-digits'
  | 'unit-changed'
  | 'negative'
  | 'meter-swap';

export interface RegisterProblem {
  kind: RegisterProblemKind;
  /** `notice`: expected and handled (a swap); `error`: a read someone should look at. */
  severity: 'error' | 'notice';
  meterRef: string;
  atUtc: string;
  message: string;
}

export interface RegisterDifferences {
  volumes: IntervalRecord[];
  /** Rollovers that were applied, so a preview can show them. */
  rollovers: Array<{ atUtc: string; from: number; to: number; volume: number }>;
  problems: RegisterProblem[];
}

const round6 = (x: number) => Math.round(x * 1e6) / 1e6;

function periodsContaining(registers: RegisterPeriod[], atMs: number): number[] {
  return registers
    .map((p, i) => ({ p, i }))
    .filter(
      ({ p }) => Date.parse(p.installedUtc) <= atMs && (p.removedUtc === null || atMs <= Date.parse(p.removedUtc)),
    )
    .map(({ i }) => i);
}

/** Differences `reads` (sorted by time, one meter) into volumes, reporting what it will not difference. */
export function differenceRegisterReads(facts: MeterRegisterFacts, reads: RegisterRecord[]): RegisterDifferences {
  const out: RegisterDifferences = { volumes: [], rollovers: [], problems: [] };
  const problem = (
    kind: RegisterProblemKind,
    read: RegisterRecord,
    message: string,
    severity: 'error' | 'notice' = 'error',
  ) => out.problems.push({ kind, severity, meterRef: facts.meterRef, atUtc: read.atUtc, message });
  type Placed = { read: RegisterRecord; atMs: number; period: number };
  let prev: Placed | null = null;

  for (const read of reads) {
    const atMs = Date.parse(read.atUtc);
    if (read.meterRef !== facts.meterRef) {
      problem('other-meter', read, `read belongs to ${read.meterRef}, not ${facts.meterRef}`);
      continue;
    }
    if (prev && atMs < prev.atMs) {
      problem('not-sorted', read, 'reads are not in time order; this read was skipped');
      continue;
    }
    const candidates = periodsContaining(facts.registers, atMs);
    let period: number | undefined = candidates.find((i) => !prev || i >= prev.period);
    if (prev && atMs === prev.atMs) {
      // Same instant: only a swap (old final read, new initial read) makes sense.
      period = candidates.find((i) => i > prev!.period);
      if (period === undefined) {
        problem('duplicate', read, 'a second read at the same time; skipped');
        continue;
      }
    }
    if (period === undefined) {
      problem('outside-install', read, 'no register was installed on this meter at this time; skipped');
      continue;
    }
    const register = facts.registers[period]!;
    const range = register.digits === null ? null : 10 ** register.digits;
    if (range !== null && read.value >= range) {
      problem('too-many-digits', read, `${read.value} does not fit a ${register.digits}-digit register; skipped`);
      continue;
    }
    const current: Placed = { read, atMs, period };
    if (!prev) {
      prev = current;
      continue;
    }
    if (prev.period !== period) {
      problem(
        'meter-swap',
        read,
        'first read on a replacement register; not differenced against the old one',
        'notice',
      );
      prev = current;
      continue;
    }
    if (prev.read.unit !== read.unit) {
      problem('unit-changed', read, `unit changed from ${prev.read.unit} to ${read.unit}; not differenced`);
      prev = current;
      continue;
    }
    let units = read.value - prev.read.value;
    if (units < 0) {
      const wrapped = range === null ? null : read.value + range - prev.read.value;
      if (wrapped === null || wrapped >= range! / 2) {
        problem(
          'negative',
          read,
          `register went down from ${prev.read.value} to ${read.value}, ` +
            'which is not a plausible rollover; not differenced',
        );
        prev = current;
        continue;
      }
      units = wrapped;
      out.rollovers.push({
        atUtc: read.atUtc,
        from: prev.read.value,
        to: read.value,
        volume: round6(units * register.multiplier),
      });
    }
    out.volumes.push({
      meterRef: facts.meterRef,
      startUtc: prev.read.atUtc,
      minutes: Math.round((atMs - prev.atMs) / 60_000),
      volume: round6(units * register.multiplier),
      unit: read.unit,
    });
    prev = current;
  }
  return out;
}
