import { describe, expect, it } from 'vitest';
import { datesBetween, spreadPeriod } from './billing-spread';

describe('spreadPeriod', () => {
  it('when every day has ETo, then each day gets usage in proportion to it, adding up to the bill exactly', () => {
    const eto = new Map([
      ['2026-06-01', 4],
      ['2026-06-02', 6],
      ['2026-06-03', 10],
    ]);
    const out = spreadPeriod({ startDate: '2026-06-01', endDate: '2026-06-03', volume: 100 }, eto);
    expect(out).toEqual({
      method: 'eto',
      days: [
        { date: '2026-06-01', volume: 20 },
        { date: '2026-06-02', volume: 30 },
        { date: '2026-06-03', volume: 50 },
      ],
    });
  });

  it('when a day has no ETo, then the period is spread evenly and says so', () => {
    const out = spreadPeriod({ startDate: '2026-06-01', endDate: '2026-06-03', volume: 10 }, new Map());
    expect(out.method).toBe('even');
    expect(out.days.map((d) => d.volume)).toEqual([3.333333, 3.333333, 3.333334]);
    expect(out.days.reduce((s, d) => s + d.volume, 0)).toBeCloseTo(10, 9);
  });

  it('dates run across month ends and leap days, both ends included', () => {
    expect(datesBetween('2028-02-28', '2028-03-01')).toEqual(['2028-02-28', '2028-02-29', '2028-03-01']);
  });
});
