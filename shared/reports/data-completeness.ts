/**
 * How much of the expected metering a site actually has, so an auditor does not rank a site low merely because
 * half its reads are missing.
 */

const MS_PER_DAY = 86_400_000;

/** present / expected as a share from 0 to 1; extra readings (duplicates, out-of-range) never push it past 1. */
export function completenessShare(present: number, expected: number): number {
  if (!Number.isInteger(present) || present < 0)
    throw new RangeError(`Present count must be a whole number, 0 or more (got ${present})`);
  if (!Number.isInteger(expected) || expected < 0)
    throw new RangeError(`Expected count must be a whole number, 0 or more (got ${expected})`);
  if (expected === 0) return 1;
  return Math.min(present, expected) / expected;
}

function parseIsoDate(date: string): number {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date);
  const ms = match ? Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3])) : Number.NaN;
  // Date.UTC rolls 2025-02-30 over to March; reject it instead.
  if (!match || new Date(ms).toISOString().slice(0, 10) !== date)
    throw new RangeError(`Not a calendar date (YYYY-MM-DD): "${date}"`);
  return ms;
}

/** Calendar days from `from` to `to`, both included. Plain dates, so time zones and DST do not enter. */
export function daysInRange(from: string, to: string): number {
  const days = (parseIsoDate(to) - parseIsoDate(from)) / MS_PER_DAY + 1;
  if (days < 1) throw new RangeError(`The range ends (${to}) before it starts (${from})`);
  return days;
}

/** Share of days in [from, to] with at least one reading; `datesWithData` may repeat and may stray outside. */
export function dailyCompleteness(
  datesWithData: Iterable<string>,
  from: string,
  to: string,
): { expectedDays: number; presentDays: number; share: number } {
  const start = parseIsoDate(from);
  const end = parseIsoDate(to);
  const expectedDays = daysInRange(from, to);
  const inside = new Set<string>();
  for (const date of datesWithData) {
    const ms = parseIsoDate(date);
    if (ms >= start && ms <= end) inside.add(date);
  }
  return { expectedDays, presentDays: inside.size, share: completenessShare(inside.size, expectedDays) };
}

/**
 * Intervals of `intervalMinutes` expected in [startMs, endMs): counted on absolute time, so a DST day simply has
 * 23 or 25 hours of intervals.
 */
export function expectedIntervals(startMs: number, endMs: number, intervalMinutes: number): number {
  if (!(intervalMinutes > 0)) throw new RangeError('The interval must be positive');
  if (!(endMs >= startMs)) throw new RangeError('The range ends before it starts');
  return Math.floor((endMs - startMs) / (intervalMinutes * 60_000));
}
