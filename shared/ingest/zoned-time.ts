/**
 * Local wall-clock time in a site's IANA zone → UTC, using only `Intl.DateTimeFormat` offsets (browsers and Node
 * both carry the tz database). Deliberately independent of date-fns-tz so the reference test can compare the two.
 * Unlike a plain conversion, it reports the two DST edge cases instead of silently picking an instant:
 * a wall time in the spring-forward gap does not exist; one in the fall-back hour exists twice.
 */

export interface WallTime {
  year: number;
  month: number; // 1–12
  day: number;
  hour: number;
  minute: number;
  second: number;
}

export type LocalResolution =
  { kind: 'unique'; utcMs: number } | { kind: 'ambiguous'; earlierUtcMs: number; laterUtcMs: number } | { kind: 'gap' };

const MINUTE = 60_000;
const DAY = 86_400_000;

/** The wall time's fields read as if they were UTC; the basis for offset arithmetic. */
export function wallTimeAsUtcMs(wall: WallTime): number {
  return Date.UTC(wall.year, wall.month - 1, wall.day, wall.hour, wall.minute, wall.second);
}

/** The UTC-field reading of an epoch as a wall time (inverse of `wallTimeAsUtcMs`). */
export function wallTimeFromUtcFields(ms: number): WallTime {
  const d = new Date(ms);
  return {
    year: d.getUTCFullYear(),
    month: d.getUTCMonth() + 1,
    day: d.getUTCDate(),
    hour: d.getUTCHours(),
    minute: d.getUTCMinutes(),
    second: d.getUTCSeconds(),
  };
}

/** Wall time `minutes` later on the clock face (ignores DST, which is the point: it moves along local labels). */
export function addWallMinutes(wall: WallTime, minutes: number): WallTime {
  return wallTimeFromUtcFields(wallTimeAsUtcMs(wall) + minutes * MINUTE);
}

export function formatWallTime(wall: WallTime): string {
  const p = (n: number, w = 2) => String(n).padStart(w, '0');
  return `${p(wall.year, 4)}-${p(wall.month)}-${p(wall.day)} ${p(wall.hour)}:${p(wall.minute)}`;
}

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(zone: string): Intl.DateTimeFormat {
  let f = formatters.get(zone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone: zone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
      second: 'numeric',
    });
    formatters.set(zone, f);
  }
  return f;
}

const HOUR = 3_600_000;

/** One zone's hour → value memory (created on first use). */
function hourMemo(memos: Map<string, Map<number, number>>, zone: string): Map<number, number> {
  let memo = memos.get(zone);
  if (!memo) memos.set(zone, (memo = new Map()));
  return memo;
}

/** Stores and returns `value`; a memory past 500,000 hours starts again, so it stays small. */
function remember(memo: Map<number, number>, hour: number, value: number): number {
  if (memo.size > 500_000) memo.clear();
  memo.set(hour, value);
  return value;
}

/** Per zone: UTC hour → offset, only for hours whose start and end share one offset (no change inside). */
const steadyHours = new Map<string, Map<number, number>>();

/**
 * Minutes to add to UTC to get the zone's local time at `utcMs` (e.g. −420 for PDT). Asking Intl costs ~5 µs, and
 * a million-row upload asks several times per row, so an hour whose two ends have the same offset is remembered:
 * no zone changes offset twice within an hour, so the whole hour has that offset. Hours holding a change are
 * always asked afresh, so results are exactly those of the uncached call.
 */
export function zoneOffsetMinutes(utcMs: number, zone: string): number {
  const cache = hourMemo(steadyHours, zone);
  const hour = Math.floor(utcMs / HOUR);
  const known = cache.get(hour);
  if (known !== undefined) return known;
  const start = intlOffsetMinutes(hour * HOUR, zone);
  if (start === intlOffsetMinutes((hour + 1) * HOUR, zone)) return remember(cache, hour, start);
  return intlOffsetMinutes(utcMs, zone);
}

function intlOffsetMinutes(utcMs: number, zone: string): number {
  const whole = Math.floor(utcMs / 1000) * 1000;
  const parts: Record<string, number> = {};
  for (const part of formatterFor(zone).formatToParts(new Date(whole))) {
    if (part.type !== 'literal') parts[part.type] = Number(part.value);
  }
  const local = Date.UTC(
    parts['year']!,
    parts['month']! - 1,
    parts['day']!,
    parts['hour']! % 24,
    parts['minute']!,
    parts['second']!,
  );
  return Math.round((local - whole) / MINUTE);
}

/**
 * Every UTC instant whose local time in `zone` is `wall`: none (gap), one, or two (fall-back fold).
 * Offsets are sampled a day either side, which covers every real zone (none changes offset twice in 48 h).
 */
export function resolveLocalTime(wall: WallTime, zone: string): LocalResolution {
  return resolveWallMs(wallTimeAsUtcMs(wall), zone);
}

/** Per zone: wall hour (read as UTC) → the one offset every wall time in it resolves with, for steady hours only. */
const steadyWallHours = new Map<string, Map<number, number>>();

/**
 * `resolveLocalTime` for a wall time given as its UTC-field reading (`wallTimeAsUtcMs`). Most wall hours are
 * nowhere near a DST change: when the offset is the same at both ends of the day before, of the day after and of
 * the hour itself (one offset change per hour at most, as `zoneOffsetMinutes` assumes), every wall time in that
 * hour resolves uniquely with that offset, so the hour is remembered. Other hours are worked out each time.
 */
export function resolveWallMs(asUtc: number, zone: string): LocalResolution {
  const cache = hourMemo(steadyWallHours, zone);
  const hour = Math.floor(asUtc / HOUR);
  const known = cache.get(hour);
  if (known !== undefined) return { kind: 'unique', utcMs: asUtc - known * MINUTE };
  const start = hour * HOUR;
  const o = zoneOffsetMinutes(start - DAY, zone);
  const steady =
    zoneOffsetMinutes(start + HOUR - DAY, zone) === o &&
    zoneOffsetMinutes(start + DAY, zone) === o &&
    zoneOffsetMinutes(start + HOUR + DAY, zone) === o &&
    zoneOffsetMinutes(start - o * MINUTE, zone) === o &&
    zoneOffsetMinutes(start + HOUR - o * MINUTE, zone) === o;
  if (steady) return { kind: 'unique', utcMs: asUtc - remember(cache, hour, o) * MINUTE };
  return resolveWallMsAfresh(asUtc, zone);
}

/** `resolveWallMs` without the steady-hour memory (the cross-check test compares the two). */
export function resolveWallMsAfresh(asUtc: number, zone: string): LocalResolution {
  const offsets = new Set([zoneOffsetMinutes(asUtc - DAY, zone), zoneOffsetMinutes(asUtc + DAY, zone)]);
  const candidates = [...offsets]
    .map((offset) => asUtc - offset * MINUTE)
    .filter((utc) => zoneOffsetMinutes(utc, zone) * MINUTE === asUtc - utc)
    .sort((a, b) => a - b);
  if (candidates.length === 0) return { kind: 'gap' };
  if (candidates.length === 1) return { kind: 'unique', utcMs: candidates[0]! };
  return { kind: 'ambiguous', earlierUtcMs: candidates[0]!, laterUtcMs: candidates[candidates.length - 1]! };
}

/** Length in hours of the local calendar day (23, 24 or 25 around DST changes). */
export function localDayHours(year: number, month: number, day: number, zone: string): number {
  const startOf = (w: WallTime) => {
    const r = resolveLocalTime(w, zone);
    // Zones that skip midnight itself start the day at the first instant after the gap; 1 h later is close enough.
    if (r.kind === 'gap') return firstInstant(resolveLocalTime({ ...w, hour: 1 }, zone));
    return firstInstant(r);
  };
  const today = { year, month, day, hour: 0, minute: 0, second: 0 };
  const tomorrow = addWallMinutes(today, 24 * 60);
  return Math.round((startOf(tomorrow) - startOf(today)) / 3_600_000);
}

function firstInstant(r: LocalResolution): number {
  if (r.kind === 'unique') return r.utcMs;
  if (r.kind === 'ambiguous') return r.earlierUtcMs;
  throw new Error('two consecutive gaps');
}
