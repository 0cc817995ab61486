import { describe, expect, it } from 'vitest';
import { addDays, dayOfYear, dayOfYearFromIso, daysInMonth, parseIsoDate } from './day-of-year';

describe('day of year', () => {
  it('when it is 31 December, then J is 365, or 366 in a leap year', () => {
    expect(dayOfYear(2025, 12, 31)).toBe(365);
    expect(dayOfYear(2024, 12, 31)).toBe(366);
    expect(dayOfYear(2100, 12, 31)).toBe(365); // 2100 is not a leap year
  });

  it('agrees with counting days for every date of a leap year', () => {
    let count = 0;
    for (let m = 1; m <= 12; m++)
      for (let d = 1; d <= daysInMonth(2028, m); d++) expect(dayOfYear(2028, m, d)).toBe(++count);
  });

  it('when a date is malformed, then it throws a clear error', () => {
    expect(() => parseIsoDate('2025-7-6')).toThrow(/YYYY-MM-DD/);
    expect(() => parseIsoDate('2025-13-01')).toThrow(/month 13/);
    expect(dayOfYearFromIso('2024-03-01')).toBe(61);
  });

  it('when adding days across a year end, then the date rolls over', () => {
    expect(addDays('2024-12-31', 1)).toBe('2025-01-01');
    expect(addDays('2024-03-01', -1)).toBe('2024-02-29');
  });
});
