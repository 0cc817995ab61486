/**
 * Where each interval column of a one-row-per-day file falls in time, on any local day including DST days.
 *
 * Convention (documented for uploaders in samples/README.md):
 * - Columns are consecutive intervals of the site's local day, starting at local midnight: 24 hourly, 48
 *   half-hourly or 96 quarter-hourly columns ("Hr 01" = 00:00–01:00, "00:15" = 00:00–00:15).
 * - Clock layout (24/48/96 columns) on a DST day: column k is the clock interval [k·step, (k+1)·step).
 *   - Spring-forward (23-hour day): the columns for the skipped clock hour (02:00–03:00, e.g. "Hr 03") must be
 *     empty or zero; a non-zero value there is an error, since that hour never happened.
 *   - Fall-back (25-hour day): the columns of the repeated clock hour (01:00–02:00, "Hr 02") hold both
 *     occurrences folded together. They become ONE interval of 120 minutes starting at the first 01:00, with
 *     the sum of those columns. Splitting it in halves would invent a shape the file does not have.
 * - Elapsed layout: 23/46/92 columns on a spring-forward day, 25/50/100 on a fall-back day are the day's real
 *   intervals in order (the repeated hour appears twice); they are only accepted on such days.
 */
import { addWallMinutes, localDayHours, resolveLocalTime, type WallTime } from './zoned-time';

export type WideSlot =
  /** Columns (offsets within the run) whose values are summed into one interval. */
  | { kind: 'interval'; columns: number[]; startUtcMs: number; minutes: number }
  /** A column for clock time that did not exist that day; must be empty or zero. */
  | { kind: 'skipped'; column: number };

export type WideDayLayout = { ok: true; slots: WideSlot[]; dayHours: number } | { ok: false; message: string };

const STEP_BY_NOMINAL: Record<number, number> = { 24: 60, 48: 30, 96: 15 };

function stepFor(count: number): number | undefined {
  for (const [nominal, step] of Object.entries(STEP_BY_NOMINAL)) {
    const n = Number(nominal);
    const perHour = 60 / step;
    if (count === n || count === n - perHour || count === n + perHour) return step;
  }
  return undefined;
}

function firstInstant(wall: WallTime, zone: string): number | null {
  const r = resolveLocalTime(wall, zone);
  if (r.kind === 'gap') return null;
  return r.kind === 'unique' ? r.utcMs : r.earlierUtcMs;
}

/** Lays out `count` interval columns over the local date `date` (time fields ignored) in `zone`. */
export function layoutWideDay(date: WallTime, count: number, zone: string): WideDayLayout {
  const step = stepFor(count);
  if (step === undefined)
    return { ok: false, message: `${count} interval columns is not an hourly, half-hourly or 15-minute day` };
  const midnight: WallTime = { year: date.year, month: date.month, day: date.day, hour: 0, minute: 0, second: 0 };
  const dayHours = localDayHours(date.year, date.month, date.day, zone);
  const dayStart = firstInstant(midnight, zone);
  if (dayStart === null) return { ok: false, message: 'the local day starts inside a DST gap' };
  const nominal = (24 * 60) / step;
  const elapsedCount = (dayHours * 60) / step;
  const label = `${date.year}-${String(date.month).padStart(2, '0')}-${String(date.day).padStart(2, '0')}`;

  if (count === elapsedCount) {
    // Elapsed layout (also the ordinary 24-hour day): columns are consecutive real intervals.
    const slots: WideSlot[] = Array.from({ length: count }, (_, k) => ({
      kind: 'interval' as const,
      columns: [k],
      startUtcMs: dayStart + k * step * 60_000,
      minutes: step,
    }));
    return { ok: true, slots, dayHours };
  }
  if (count !== nominal) {
    return { ok: false, message: `${count} interval columns do not fit ${label}, a ${dayHours}-hour day in ${zone}` };
  }

  const slots: WideSlot[] = [];
  let fold: { columns: number[]; startUtcMs: number } | null = null;
  for (let k = 0; k < count; k++) {
    const wall = addWallMinutes(midnight, k * step);
    const r = resolveLocalTime(wall, zone);
    if (r.kind === 'gap') {
      slots.push({ kind: 'skipped', column: k });
      continue;
    }
    if (r.kind === 'ambiguous') {
      fold ??= { columns: [], startUtcMs: r.earlierUtcMs };
      fold.columns.push(k);
      continue;
    }
    if (fold) {
      // The folded run ends where this unambiguous clock time begins.
      slots.push({
        kind: 'interval',
        columns: fold.columns,
        startUtcMs: fold.startUtcMs,
        minutes: (r.utcMs - fold.startUtcMs) / 60_000,
      });
      fold = null;
    }
    slots.push({ kind: 'interval', columns: [k], startUtcMs: r.utcMs, minutes: step });
  }
  if (fold) {
    const end = firstInstant(addWallMinutes(midnight, 24 * 60), zone) ?? dayStart + dayHours * 3_600_000;
    slots.push({
      kind: 'interval',
      columns: fold.columns,
      startUtcMs: fold.startUtcMs,
      minutes: (end - fold.startUtcMs) / 60_000,
    });
  }
  return { ok: true, slots, dayHours };
}
