import { describe, expect, it } from 'vitest';
import { percentOfBudget, trendVsLastYear } from './budget-compliance';

describe('percent of budget', () => {
  it('when 150,000 gal are used against a 120,000 gal budget, then it is 125 %', () => {
    expect(percentOfBudget(150_000, 120_000)).toBe(125);
  });

  it('when under budget, then below 100; when nothing is used, then 0', () => {
    expect(percentOfBudget(30_000, 120_000)).toBe(25);
    expect(percentOfBudget(0, 120_000)).toBe(0);
  });

  it('when there is no budget (zero or missing), then null rather than Infinity', () => {
    expect(percentOfBudget(10, 0)).toBeNull();
    expect(percentOfBudget(10, null)).toBeNull();
  });

  it('when use or budget are negative or not numbers, then it refuses', () => {
    expect(() => percentOfBudget(-1, 100)).toThrow(RangeError);
    expect(() => percentOfBudget(1, -100)).toThrow(RangeError);
    expect(() => percentOfBudget(Number.NaN, 100)).toThrow(RangeError);
  });
});

describe('trend against last year', () => {
  it('when use rises from 80,000 to 100,000 gal, then +25 %; when it falls to 60,000, then −25 %', () => {
    expect(trendVsLastYear(100_000, 80_000)).toBe(25);
    expect(trendVsLastYear(60_000, 80_000)).toBe(-25);
  });

  it('when last year had no use or no data, then null', () => {
    expect(trendVsLastYear(5, 0)).toBeNull();
    expect(trendVsLastYear(5, null)).toBeNull();
  });
});
