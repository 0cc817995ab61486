/** Calendar helpers for ISO dates ("YYYY-MM-DD"). Pure arithmetic, no time zones involved. */

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

export function daysInMonth(year: number, month: number): number {
  return [31, isLeapYear(year) ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][month - 1]!;
}

/** Splits and checks an ISO date; throws a RangeError naming the bad part. */
export function parseIsoDate(isoDate: string): { year: number; month: number; day: number } {
  const match = ISO_DATE.exec(isoDate);
  if (!match) throw new RangeError(`Date "${isoDate}" is not in YYYY-MM-DD form`);
  const year = Number(match[1]);
  const month = Number(match[2]);
  const day = Number(match[3]);
  if (month < 1 || month > 12) throw new RangeError(`Date "${isoDate}" has month ${month}; it must be 1–12`);
  if (day < 1 || day > daysInMonth(year, month)) {
    throw new RangeError(`Date "${isoDate}" has day ${day}; that month has ${daysInMonth(year, month)} days`);
  }
  return { year, month, day };
}

/**
 * Day of the year J, 1–366, by the FAO-56 Annex 2 (Table 2.5 note) formula:
 * J = INT(275M/9 − 30 + D) − 2, +2 when M < 3, +1 in leap years from March on.
 */
export function dayOfYear(year: number, month: number, day: number): number {
  let j = Math.floor((275 * month) / 9 - 30 + day) - 2;
  if (month < 3) j += 2;
  if (isLeapYear(year) && month > 2) j += 1;
  return j;
}

export function dayOfYearFromIso(isoDate: string): number {
  const { year, month, day } = parseIsoDate(isoDate);
  return dayOfYear(year, month, day);
}

/** The ISO date `days` after `isoDate` (negative to go back). */
export function addDays(isoDate: string, days: number): string {
  const { year, month, day } = parseIsoDate(isoDate);
  return new Date(Date.UTC(year, month - 1, day + days)).toISOString().slice(0, 10);
}
