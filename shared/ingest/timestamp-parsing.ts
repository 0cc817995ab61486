/**
 * Timestamp cells → either an exact instant (the text carried `Z` or an offset) or a local wall time that the
 * caller resolves in the site's zone. Accepted: ISO 8601 (`2026-11-01T01:00`, `2026-11-01 01:00:00-07:00`,
 * `...Z`), date-only `yyyy-mm-dd`, US `m/d/yyyy h:mm AM/PM` and `m/d/yyyy HH:mm`, and spreadsheet serial dates
 * in the 1900 date system (45292 = 2024-01-01, 45292.5 = noon). Day-first dates (`d/m/yyyy`) are not accepted:
 * `3/8/2026` is read as 8 March, because the product serves US exports.
 */
import { addWallMinutes, type WallTime } from './zoned-time';

export type ParsedTimestamp =
  | { ok: true; kind: 'instant'; utcMs: number }
  | { ok: true; kind: 'wall'; wall: WallTime; dateOnly: boolean }
  | { ok: false; message: string };

export type ParsedTimeOfDay = { ok: true; minutes: number; seconds: number } | { ok: false; message: string };

const iso =
  /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{1,2}):(\d{2})(?::(\d{2})(?:\.\d+)?)?)?\s*(Z|[+-]\d{2}(?::?\d{2})?)?$/i;
const us = /^(\d{1,2})\/(\d{1,2})\/(\d{4})(?:\s+(\d{1,2}):(\d{2})(?::(\d{2}))?\s*([AP]\.?M\.?)?)?$/i;
const serial = /^\d{1,7}(?:\.\d+)?$/;
const clock = /^(\d{1,2}):(\d{2})(?::(\d{2}))?\s*([AP]\.?M\.?)?$/i;

/** Spreadsheet serials before 1950 or after 2100 are almost surely not dates (an id or a volume). */
const SERIAL_MIN = 18264; // 1950-01-01
const SERIAL_MAX = 73051; // 2100-01-01

function daysInMonth(year: number, month: number): number {
  return new Date(Date.UTC(year, month, 0)).getUTCDate();
}

function validDate(y: number, m: number, d: number): boolean {
  return m >= 1 && m <= 12 && d >= 1 && d <= daysInMonth(y, m);
}

/** Hour 24:00 is accepted as the next day's midnight (interval-end labels use it). */
function buildWall(y: number, mo: number, d: number, h: number, mi: number, s: number): WallTime | string {
  if (!validDate(y, mo, d)) return 'is not a calendar date';
  if (h === 24 && mi === 0 && s === 0) return addWallMinutes({ year: y, month: mo, day: d, hour: 0, minute: 0, second: 0 }, 24 * 60);
  if (h > 23 || mi > 59 || s > 59) return 'has an impossible time of day';
  return { year: y, month: mo, day: d, hour: h, minute: mi, second: s };
}

function to24Hour(hour: number, meridiem: string | undefined): number | null {
  if (!meridiem) return hour;
  if (hour < 1 || hour > 12) return null;
  const pm = meridiem.toUpperCase().startsWith('P');
  return (hour % 12) + (pm ? 12 : 0);
}

/** Spreadsheet serial (1900 system) → wall time. Serials after 60 absorb the fictitious 1900-02-29. */
export function spreadsheetSerialToWall(value: number): WallTime {
  const wholeDays = Math.floor(value);
  const seconds = Math.round((value - wholeDays) * 86_400); // serials carry float noise; a second is plenty
  const epochDay = Date.UTC(1899, 11, 30) + wholeDays * 86_400_000 + seconds * 1000;
  const d = new Date(epochDay);
  return {
    year: d.getUTCFullYear(),
    month: d.getUTCMonth() + 1,
    day: d.getUTCDate(),
    hour: d.getUTCHours(),
    minute: d.getUTCMinutes(),
    second: d.getUTCSeconds(),
  };
}

function parseOffsetMinutes(text: string): number {
  if (text.toUpperCase() === 'Z') return 0;
  const sign = text.startsWith('-') ? -1 : 1;
  const digits = text.slice(1).replace(':', '');
  return sign * (Number(digits.slice(0, 2)) * 60 + Number(digits.slice(2) || '0'));
}

/** Parses one timestamp cell (see the file comment for the accepted forms). */
export function parseTimestamp(text: string): ParsedTimestamp {
  const t = text.trim();
  if (t === '') return { ok: false, message: 'is empty' };
  const fail = (why: string): ParsedTimestamp => ({ ok: false, message: `"${t}" ${why}` });

  let m = iso.exec(t);
  if (m) {
    const hasTime = m[4] !== undefined;
    const wall = buildWall(+m[1]!, +m[2]!, +m[3]!, hasTime ? +m[4]! : 0, hasTime ? +m[5]! : 0, m[6] ? +m[6] : 0);
    if (typeof wall === 'string') return fail(wall);
    if (m[7]) {
      if (!hasTime) return fail('has an offset but no time');
      const utcMs = Date.UTC(wall.year, wall.month - 1, wall.day, wall.hour, wall.minute, wall.second);
      return { ok: true, kind: 'instant', utcMs: utcMs - parseOffsetMinutes(m[7]) * 60_000 };
    }
    return { ok: true, kind: 'wall', wall, dateOnly: !hasTime };
  }

  m = us.exec(t);
  if (m) {
    const hasTime = m[4] !== undefined;
    const hour = hasTime ? to24Hour(+m[4]!, m[7]) : 0;
    if (hour === null) return fail('has an hour that does not fit AM/PM');
    const wall = buildWall(+m[3]!, +m[1]!, +m[2]!, hour, hasTime ? +m[5]! : 0, m[6] ? +m[6] : 0);
    if (typeof wall === 'string') return fail(`${wall} (dates are read as month/day/year)`);
    return { ok: true, kind: 'wall', wall, dateOnly: !hasTime };
  }

  if (serial.test(t)) {
    const value = Number(t);
    if (value < SERIAL_MIN || value >= SERIAL_MAX) return fail('is a number but not a plausible spreadsheet date');
    return { ok: true, kind: 'wall', wall: spreadsheetSerialToWall(value), dateOnly: Number.isInteger(value) };
  }

  return fail('is not a date/time this reader understands (ISO 8601, m/d/yyyy h:mm AM/PM, or a spreadsheet serial)');
}

/** A time-of-day cell: `14:00`, `2:00 PM`, `14:00:00`, `24:00` (= end of day), or a spreadsheet fraction `0.5`. */
export function parseTimeOfDay(text: string): ParsedTimeOfDay {
  const t = text.trim();
  if (t === '') return { ok: false, message: 'is empty' };
  const m = clock.exec(t);
  if (m) {
    const hour = to24Hour(+m[1]!, m[4]);
    const minute = +m[2]!;
    const second = m[3] ? +m[3] : 0;
    const endOfDay = hour === 24 && minute === 0 && second === 0;
    if (hour === null || (!endOfDay && (hour > 23 || minute > 59 || second > 59))) {
      return { ok: false, message: `"${t}" is not a time of day` };
    }
    return { ok: true, minutes: hour * 60 + minute, seconds: second };
  }
  if (/^0?\.\d+$/.test(t)) {
    const total = Math.round(Number(t) * 86_400);
    return { ok: true, minutes: Math.floor(total / 60), seconds: total % 60 };
  }
  return { ok: false, message: `"${t}" is not a time of day (expected e.g. 14:00 or 2:00 PM)` };
}

/** A date cell followed by a separate time cell. The date cell must not carry its own time or offset. */
export function combineDateAndTime(dateText: string, timeText: string): ParsedTimestamp {
  const date = parseTimestamp(dateText);
  if (!date.ok) return date;
  if (date.kind !== 'wall' || !date.dateOnly) {
    return { ok: false, message: `"${dateText.trim()}" should be a date only, since the time is in its own column` };
  }
  const time = parseTimeOfDay(timeText);
  if (!time.ok) return time;
  const wall = addWallMinutes(date.wall, time.minutes);
  return { ok: true, kind: 'wall', wall: { ...wall, second: time.seconds }, dateOnly: false };
}
