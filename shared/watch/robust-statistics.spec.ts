import { describe, expect, it } from 'vitest';
import { mad, median, robustUpperLimit, scaledMad } from './robust-statistics';

describe('median', () => {
  it('takes the middle of an odd count and the mean of the middle two of an even count', () => {
    expect(median([5, 1, 3])).toBe(3);
    expect(median([4, 1, 3, 2])).toBe(2.5);
  });

  it("does not reorder the caller's array", () => {
    const values = [3, 1, 2];
    median(values);
    expect(values).toEqual([3, 1, 2]);
  });

  it('refuses an empty list', () => {
    expect(() => median([])).toThrow(RangeError);
  });
});

describe('mad', () => {
  it('is the median distance from the median, by hand', () => {
    // median 3; distances 2, 0, 1, 1, 6 → sorted 0, 1, 1, 2, 6 → 1.
    expect(mad([1, 3, 2, 4, 9])).toBe(1);
  });

  it('barely moves when one value goes wild, unlike the standard deviation', () => {
    const calm = [10, 11, 9, 10, 12, 10, 9, 11];
    const wild = [...calm.slice(0, -1), 500];
    expect(mad(wild)).toBe(mad(calm));
  });

  it('is zero for a constant history', () => {
    expect(scaledMad([0, 0, 0, 0])).toBe(0);
  });

  it('scales to about one standard deviation for normal-shaped data', () => {
    // Quantiles of N(0,1) at 1/8 … 7/8 spacing: symmetric, so the scaled MAD should be near 1.
    const quantiles = [-1.15, -0.674, -0.319, 0, 0.319, 0.674, 1.15];
    expect(scaledMad(quantiles)).toBeCloseTo(0.999, 2);
  });
});

describe('robustUpperLimit', () => {
  it('adds k scaled MADs to the median', () => {
    const r = robustUpperLimit([1, 3, 2, 4, 9], 3, 0);
    expect(r.median).toBe(3);
    expect(r.limit).toBeCloseTo(3 + 3 * 1.4826, 6);
  });

  it('uses the minimum margin when the history is perfectly steady', () => {
    expect(robustUpperLimit([0, 0, 0], 4, 3).limit).toBe(3);
  });
});
