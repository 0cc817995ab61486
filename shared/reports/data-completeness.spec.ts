import { describe, expect, it } from 'vitest';
import { completenessShare, dailyCompleteness, daysInRange, expectedIntervals } from './data-completeness';

describe('data completeness', () => {
  it('when 27 of 30 expected reads are present, then 0.9', () => {
    expect(completenessShare(27, 30)).toBeCloseTo(0.9, 15);
  });

  it('when duplicates make present exceed expected, then it stops at 1', () => {
    expect(completenessShare(35, 30)).toBe(1);
  });

  it('when nothing is expected, then the period is complete', () => {
    expect(completenessShare(0, 0)).toBe(1);
  });

  it('when counts are fractional or negative, then it refuses', () => {
    expect(() => completenessShare(1.5, 3)).toThrow(RangeError);
    expect(() => completenessShare(1, -3)).toThrow(RangeError);
  });

  it('when counting days, then both ends count and leap days are in: 2024-02-01..2024-02-29 is 29 days', () => {
    expect(daysInRange('2024-02-01', '2024-02-29')).toBe(29);
    expect(daysInRange('2025-01-01', '2025-12-31')).toBe(365);
    expect(daysInRange('2025-03-09', '2025-03-09')).toBe(1);
  });

  it('when a date is impossible or the range is backwards, then it refuses', () => {
    expect(() => daysInRange('2025-02-30', '2025-03-01')).toThrow(/calendar date/);
    expect(() => daysInRange('2025-03-02', '2025-03-01')).toThrow(/before it starts/);
  });

  it('when 3 distinct days of a 10-day range have data (one repeated, one outside), then 0.3', () => {
    const result = dailyCompleteness(
      ['2025-06-01', '2025-06-01', '2025-06-05', '2025-06-10', '2025-06-11'],
      '2025-06-01',
      '2025-06-10',
    );
    expect(result).toEqual({ expectedDays: 10, presentDays: 3, share: 0.3 });
  });

  it('when counting 15-minute intervals over a day, then 96; over the 23-hour DST spring-forward day, then 92', () => {
    const start = Date.UTC(2025, 5, 1);
    expect(expectedIntervals(start, start + 24 * 3_600_000, 15)).toBe(96);
    // Los Angeles, 2025-03-09: local midnight is 08:00Z; next local midnight is 07:00Z on the 10th.
    expect(expectedIntervals(Date.UTC(2025, 2, 9, 8), Date.UTC(2025, 2, 10, 7), 15)).toBe(92);
  });
});
