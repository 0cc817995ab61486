/**
 * Timestamp cells → either an exact instant (the text carried `Z` or an offset) or a local wall time that the
 * caller resolves in the site's zone. Accepted: ISO 8601 (`2026-11-01T01:00`, `2026-11-01 01:00:00-07:00`,
 * `...Z`), date-only `yyyy-mm-dd`, numeric dates with `/`, `.` or `-` and a 4- or 2-digit year (`6/8/2026 1:00 PM`,
 * `13.06.2026 14:00`, `08-06-26`), and spreadsheet serial dates in the 1900 date system (45292 = 2024-01-01,
 * 45292.5 = noon). Numeric dates are read in the order given (month-first unless told otherwise); which order a
 * file uses is decided from all of its dates (`date-order.ts`), so every numeric date reports its two fields.
 */
import type { DateOrder } from './date-order';
import { addWallMinutes, type WallTime } from './zoned-time';

/** The two leading fields of a numeric date (`13/06/2026` → 13 and 6), for deciding the file's date order. */
export interface NumericDateFields {
  first: number;
  second: number;
}

export type ParsedTimestamp =
  | { ok: true; kind: 'instant'; utcMs: number }
  | { ok: true; kind: 'wall'; wall: WallTime; dateOnly: boolean; numericDate?: NumericDateFields }
  | { ok: false; message: string; numericDate?: NumericDateFields };

export type ParsedTimeOfDay = { ok: true; minutes: number; seconds: number } | { ok: false; message: string };

const iso = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{1,2}):(\d{2})(?::(\d{2})(?:\.\d+)?)?)?\s*(Z|[+-]\d{2}(?::?\d{2})?)?$/i;
const numeric = /^(\d{1,2})([/.-])(\d{1,2})\2(\d{4}|\d{2})(?:[\sT]+(\d{1,2}):(\d{2})(?::(\d{2}))?\s*([AP]\.?M\.?)?)?$/i;
const serial = /^\d{1,7}(?:\.\d+)?$/;
const clock = /^(\d{1,2}):(\d{2})(?::(\d{2}))?\s*([AP]\.?M\.?)?$/i;

/** Spreadsheet serials before 1950 or after 2100 are almost surely not dates (an id or a volume). */
const SERIAL_MIN = 18264; // 1950-01-01
const SERIAL_MAX = 73051; // 2100-01-01

const MONTH_DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

function daysInMonth(year: number, month: number): number {
  if (month !== 2) return MONTH_DAYS[month - 1]!;
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28;
}

function validDate(y: number, m: number, d: number): boolean {
  return m >= 1 && m <= 12 && d >= 1 && d <= daysInMonth(y, m);
}

/** Hour 24:00 is accepted as the next day's midnight (interval-end labels use it). */
function buildWall(y: number, mo: number, d: number, h: number, mi: number, s: number): WallTime | string {
  if (!validDate(y, mo, d)) return 'is not a calendar date';
  if (h === 24 && mi === 0 && s === 0)
    return addWallMinutes({ year: y, month: mo, day: d, hour: 0, minute: 0, second: 0 }, 24 * 60);
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

/** Digit value of `text[i]`, or -1 (charCode arithmetic: the fast path below runs for every row of a big file). */
function digitAt(text: string, i: number): number {
  const c = text.charCodeAt(i) - 48;
  return c >= 0 && c <= 9 ? c : -1;
}

/**
 * The common export form `yyyy-mm-dd hh:mm[:ss]` (or with `T`), read without a regular expression; `null` for
 * anything else, which then takes the general path. Same results as the general path for the text it accepts.
 */
function parsePlainIso(t: string): ParsedTimestamp | null {
  const n = t.length;
  if (n !== 16 && n !== 19) return null;
  if (t.charCodeAt(4) !== 45 || t.charCodeAt(7) !== 45 || t.charCodeAt(13) !== 58) return null;
  const sep = t.charCodeAt(10);
  if (sep !== 32 && sep !== 84 && sep !== 116) return null;
  if (n === 19 && t.charCodeAt(16) !== 58) return null;
  const y0 = digitAt(t, 0),
    y1 = digitAt(t, 1),
    y2 = digitAt(t, 2),
    y3 = digitAt(t, 3);
  const mo0 = digitAt(t, 5),
    mo1 = digitAt(t, 6),
    d0 = digitAt(t, 8),
    d1 = digitAt(t, 9);
  const h0 = digitAt(t, 11),
    h1 = digitAt(t, 12),
    mi0 = digitAt(t, 14),
    mi1 = digitAt(t, 15);
  if ((y0 | y1 | y2 | y3 | mo0 | mo1 | d0 | d1 | h0 | h1 | mi0 | mi1) < 0) return null;
  let second = 0;
  if (n === 19) {
    const s0 = digitAt(t, 17),
      s1 = digitAt(t, 18);
    if ((s0 | s1) < 0) return null;
    second = s0 * 10 + s1;
  }
  const year = y0 * 1000 + y1 * 100 + y2 * 10 + y3;
  const month = mo0 * 10 + mo1;
  const day = d0 * 10 + d1;
  const hour = h0 * 10 + h1;
  const minute = mi0 * 10 + mi1;
  // 24:00 and impossible values keep their own messages on the general path.
  if (hour > 23 || minute > 59 || second > 59 || !validDate(year, month, day)) return null;
  return { ok: true, kind: 'wall', wall: { year, month, day, hour, minute, second }, dateOnly: false };
}

/** Parses one timestamp cell (see the file comment for the accepted forms); numeric dates in `order`. */
export function parseTimestamp(text: string, order: DateOrder = 'month-first'): ParsedTimestamp {
  const t = text.trim();
  if (t === '') return { ok: false, message: 'is empty' };
  const plain = parsePlainIso(t);
  if (plain) return plain;
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

  m = numeric.exec(t);
  if (m) return parseNumericDate(m, order, t);

  if (serial.test(t)) {
    const value = Number(t);
    if (value < SERIAL_MIN || value >= SERIAL_MAX) return fail('is a number but not a plausible spreadsheet date');
    return { ok: true, kind: 'wall', wall: spreadsheetSerialToWall(value), dateOnly: Number.isInteger(value) };
  }

  return fail(
    'is not a date/time this reader understands (ISO 8601, m/d/yyyy or d/m/yyyy with a time, or a spreadsheet serial)',
  );
}

const ORDER_PATTERN: Record<DateOrder, string> = { 'month-first': 'm/d/yyyy', 'day-first': 'd/m/yyyy' };

/** `first sep second sep year [time]`, read in `order`; two-digit years are 2000–2099. */
function parseNumericDate(m: RegExpExecArray, order: DateOrder, text: string): ParsedTimestamp {
  const numericDate = { first: +m[1]!, second: +m[3]! };
  const failed = (why: string): ParsedTimestamp => ({ ok: false, message: `"${text}" ${why}`, numericDate });
  const year = m[4]!.length === 2 ? 2000 + +m[4]! : +m[4]!;
  const dayFirst = order === 'day-first';
  const month = dayFirst ? numericDate.second : numericDate.first;
  const day = dayFirst ? numericDate.first : numericDate.second;
  const hasTime = m[5] !== undefined;
  const hour = hasTime ? to24Hour(+m[5]!, m[8]) : 0;
  if (hour === null) return failed('has an hour that does not fit AM/PM');
  const wall = buildWall(year, month, day, hour, hasTime ? +m[6]! : 0, m[7] ? +m[7] : 0);
  if (typeof wall === 'string') return failed(`${wall} when read ${order} (${ORDER_PATTERN[order]})`);
  return { ok: true, kind: 'wall', wall, dateOnly: !hasTime, numericDate };
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
export function combineDateAndTime(
  dateText: string,
  timeText: string,
  order: DateOrder = 'month-first',
): ParsedTimestamp {
  const date = parseTimestamp(dateText, order);
  if (!date.ok) return date;
  if (date.kind !== 'wall' || !date.dateOnly) {
    return { ok: false, message: `"${dateText.trim()}" should be a date only, since the time is in its own column` };
  }
  const time = parseTimeOfDay(timeText);
  if (!time.ok) return time;
  const wall = addWallMinutes(date.wall, time.minutes);
  const combined = { ...wall, second: time.seconds };
  return { ok: true, kind: 'wall', wall: combined, dateOnly: false, numericDate: date.numericDate };
}
