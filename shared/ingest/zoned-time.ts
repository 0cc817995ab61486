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
  | { kind: 'unique'; utcMs: number }
  | { kind: 'ambiguous'; earlierUtcMs: number; laterUtcMs: number }
  | { kind: 'gap' };

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
/** Per zone: UTC hour → offset, only for hours whose start and end share one offset (no change inside). */
const steadyHours = new Map<string, Map<number, number>>();

/**
 * Minutes to add to UTC to get the zone's local time at `utcMs` (e.g. −420 for PDT). Asking Intl costs ~5 µs, and
 * a million-row upload asks several times per row, so an hour whose two ends have the same offset is remembered:
 * no zone changes offset twice within an hour, so the whole hour has that offset. Hours holding a change are
 * always asked afresh, so results are exactly those of the uncached call.
 */
export function zoneOffsetMinutes(utcMs: number, zone: string): number {
  let cache = steadyHours.get(zone);
  if (!cache) steadyHours.set(zone, (cache = new Map()));
  const hour = Math.floor(utcMs / HOUR);
  const known = cache.get(hour);
  if (known !== undefined) return known;
  const start = intlOffsetMinutes(hour * HOUR, zone);
  if (start === intlOffsetMinutes((hour + 1) * HOUR, zone)) {
    if (cache.size > 500_000) cache.clear();
    cache.set(hour, start);
    return start;
  }
  return intlOffsetMinutes(utcMs, zone);
}

function intlOffsetMinutes(utcMs: number, zone: string): number {
  const whole = Math.floor(utcMs / 1000) * 1000;
  const parts: Record<string, number> = {};
  for (const part of formatterFor(zone).formatToParts(new Date(whole))) {
    if (part.type !== 'literal') parts[part.type] = Number(part.value);
  }
  const local = Date.UTC(parts['year']!, parts['month']! - 1, parts['day']!, parts['hour']! % 24, parts['minute']!, parts['second']!);
  return Math.round((local - whole) / MINUTE);
}

/**
 * Every UTC instant whose local time in `zone` is `wall`: none (gap), one, or two (fall-back fold).
 * Offsets are sampled a day either side, which covers every real zone (none changes offset twice in 48 h).
 */
export function resolveLocalTime(wall: WallTime, zone: string): LocalResolution {
  const asUtc = wallTimeAsUtcMs(wall);
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
