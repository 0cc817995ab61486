/**
 * Local calendar facts for UTC hours in a site's zone. Night and the irrigation window are local wall-clock
 * hours, so a DST day has 23 or 25 hours and the same UTC hour falls in different local hours across the year.
 */
import { zoneOffsetMinutes } from '../ingest/zoned-time';
import type { LocalHourWindow } from './watch-inputs';

export const HOUR_MS = 3_600_000;
export const DAY_MS = 86_400_000;

export interface LocalHour {
  /** `YYYY-MM-DD` in the site's zone. */
  date: string;
  /** `YYYY-MM`. */
  month: string;
  /** 0–23 local hour at the interval's start. */
  hour: number;
}

// Intl formatting is the slow part; an hour's offset never changes, so remember it.
const offsetCache = new Map<string, number>();

function cachedOffsetMinutes(utcMs: number, zone: string): number {
  const key = `${zone}|${Math.floor(utcMs / 900_000)}`;
  let offset = offsetCache.get(key);
  if (offset === undefined) {
    if (offsetCache.size > 500_000) offsetCache.clear();
    offset = zoneOffsetMinutes(utcMs, zone);
    offsetCache.set(key, offset);
  }
  return offset;
}

/** The local date, month and hour of an instant in `zone`. */
export function localHourOf(utcMs: number, zone: string): LocalHour {
  const local = new Date(utcMs + cachedOffsetMinutes(utcMs, zone) * 60_000);
  const iso = local.toISOString();
  return { date: iso.slice(0, 10), month: iso.slice(0, 7), hour: local.getUTCHours() };
}

/** `YYYY-MM-DD HH:MM` wall time of an instant in `zone`, for alert texts. */
export function localDateTimeOf(utcMs: number, zone: string): string {
  return new Date(utcMs + cachedOffsetMinutes(utcMs, zone) * 60_000).toISOString().slice(0, 16).replace('T', ' ');
}

/** True when a local hour falls in [start, end), wrapping past midnight when start > end. */
export function inLocalWindow(hour: number, window: LocalHourWindow): boolean {
  if (window.startHour === window.endHour) return false;
  return window.startHour < window.endHour
    ? hour >= window.startHour && hour < window.endHour
    : hour >= window.startHour || hour < window.endHour;
}

/** The ISO date one day after `date`. */
export function nextDate(date: string): string {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return new Date(Date.UTC(y, m - 1, d + 1)).toISOString().slice(0, 10);
}

/**
 * Which night an hour belongs to, named by the morning's date, so a window that wraps past midnight
 * (e.g. 22–5) keeps its hours together.
 */
export function nightOf(local: LocalHour, window: LocalHourWindow): string | null {
  if (!inLocalWindow(local.hour, window)) return null;
  const wraps = window.startHour > window.endHour;
  return wraps && local.hour >= window.startHour ? nextDate(local.date) : local.date;
}

/** Number of days in a `YYYY-MM` month. */
export function daysInMonthKey(month: string): number {
  const [y, m] = month.split('-').map(Number) as [number, number];
  return new Date(Date.UTC(y, m, 0)).getUTCDate();
}

/**
 * The UTC instant of local midnight starting `date` in `zone`. Searches the offsets either side, so DST days work;
 * a zone that skips midnight itself gets the first instant after the gap.
 */
export function localMidnightUtc(date: string, zone: string): number {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  const asUtc = Date.UTC(y, m - 1, d);
  for (const probe of [asUtc - DAY_MS, asUtc + DAY_MS]) {
    const candidate = asUtc - cachedOffsetMinutes(probe, zone) * 60_000;
    const back = localHourOf(candidate, zone);
    if (back.date === date && back.hour === 0) return candidate;
  }
  // Midnight does not exist that day: take the first hour of the day.
  return asUtc - cachedOffsetMinutes(asUtc + DAY_MS, zone) * 60_000;
}
