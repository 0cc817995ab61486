/**
 * Cumulative register reads of one meter → interval volumes between consecutive reads.
 * - Rollover: a register with d digits wraps at 10^d, so 9,998 → 0,003 on 4 digits is 5 units. A negative
 *   difference counts as a rollover only when the wrapped usage is under half the dial's range; otherwise it is
 *   more likely a misread or a reset, and is reported rather than turned into a huge volume. After a reported
 *   drop, the newer read becomes the base (the latest read is the one a field check confirms).
 * - Meter swaps: each physical register has an install (and removal) time; two reads on different registers are
 *   never differenced. A read exactly at the swap instant may be both the old meter's final and the new one's
 *   initial read: the first such read goes to the old register, the next to the new.
 * - Multiplier: register units × multiplier = volume in the read's unit (e.g. a ×10 dial). A read that carries
 *   its own multiplier or digits (a file column) uses them instead of the register's settings.
 * - Serials: when a file names the physical meter, a change of serial between two reads is a swap too, even where
 *   no register period says so yet (the upload then records one).
 * - Estimated: a volume from an estimated read is estimated.
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

/** A read placed on its register: `serial` is the physical meter's when the file names it. */
interface Placed {
  read: RegisterRecord;
  atMs: number;
  period: number;
}

/** The register a read belongs to, or why it cannot be placed. */
function placeRead(
  registers: RegisterPeriod[],
  read: RegisterRecord,
  atMs: number,
  prev: Placed | null,
): number | { kind: RegisterProblemKind; message: string } {
  const candidates = periodsContaining(registers, atMs);
  if (prev && atMs === prev.atMs) {
    // Same instant: only a swap (old final read, new initial read) makes sense: a later register, or a new serial.
    const later = candidates.find((i) => i > prev.period);
    if (later !== undefined) return later;
    if (serialChanged(prev.read, read)) return prev.period;
    return { kind: 'duplicate', message: 'a second read at the same time; skipped' };
  }
  const period = candidates.find((i) => !prev || i >= prev.period);
  if (period === undefined)
    return { kind: 'outside-install', message: 'no register was installed on this meter at this time; skipped' };
  return period;
}

const serialChanged = (a: RegisterRecord, b: RegisterRecord) =>
  a.serial !== undefined && b.serial !== undefined && a.serial !== b.serial;

/** The read's own multiplier and digits when the file gave them, else its register's. */
function readFacts(register: RegisterPeriod, read: RegisterRecord): { multiplier: number; digits: number | null } {
  return { multiplier: read.multiplier ?? register.multiplier, digits: read.digits ?? register.digits };
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
    const period = placeRead(facts.registers, read, atMs, prev);
    if (typeof period !== 'number') {
      problem(period.kind, read, period.message);
      continue;
    }
    const { multiplier, digits } = readFacts(facts.registers[period]!, read);
    const range = digits === null ? null : 10 ** digits;
    if (range !== null && read.value >= range) {
      problem('too-many-digits', read, `${read.value} does not fit a ${digits}-digit register; skipped`);
      continue;
    }
    const current: Placed = { read, atMs, period };
    if (!prev) {
      prev = current;
      continue;
    }
    if (prev.period !== period || serialChanged(prev.read, read)) {
      const what = serialChanged(prev.read, read) ? `serial ${prev.read.serial} → ${read.serial}: ` : '';
      problem(
        'meter-swap',
        read,
        `${what}first read on a replacement register; not differenced against the old one`,
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
        volume: round6(units * multiplier),
      });
    }
    const volume: IntervalRecord = {
      meterRef: facts.meterRef,
      startUtc: prev.read.atUtc,
      minutes: Math.round((atMs - prev.atMs) / 60_000),
      volume: round6(units * multiplier),
      unit: read.unit,
    };
    if (prev.read.estimated || read.estimated) volume.estimated = true;
    out.volumes.push(volume);
    prev = current;
  }
  return out;
}

/** Where the serial changes between consecutive reads: the old serial's final read and the new one's first. */
export interface SerialSwap {
  meterRef: string;
  fromSerial: string;
  toSerial: string;
  /** The old serial's last read and the new serial's first (the swap instant). */
  finalReadUtc: string;
  initialReadUtc: string;
  initial: RegisterRecord;
}

export function serialSwaps(reads: RegisterRecord[]): SerialSwap[] {
  const swaps: SerialSwap[] = [];
  for (let i = 1; i < reads.length; i++) {
    const [a, b] = [reads[i - 1]!, reads[i]!];
    if (!serialChanged(a, b)) continue;
    swaps.push({
      meterRef: b.meterRef,
      fromSerial: a.serial!,
      toSerial: b.serial!,
      finalReadUtc: a.atUtc,
      initialReadUtc: b.atUtc,
      initial: b,
    });
  }
  return swaps;
}
