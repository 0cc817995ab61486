import { describe, expect, it } from 'vitest';
import {
  auditedEfficiency,
  catchCanPrecipitationRate,
  catchDepthsIn,
  lowQuarterCount,
  lowQuarterUniformity,
  rateUniformity,
  schedulingMultiplier,
  throatAreaIn2,
} from './catch-can';

// Invented catches.
describe('catch-can arithmetic', () => {
  it('when 16 cans are read, then the lowest 4 form the lowest quarter', () => {
    const catches = [10, 12, 9, 11, 10, 8, 12, 13, 7, 10, 11, 9, 12, 10, 6, 14];
    const u = lowQuarterUniformity(catches);
    expect(u.lowQuarterCount).toBe(4);
    expect(u.lowQuarterMean).toBeCloseTo((6 + 7 + 8 + 9) / 4, 10);
    expect(u.du).toBeCloseTo(7.5 / (164 / 16), 10);
  });

  it('when n/4 ends in a half, then it rounds to even as R does (10 → 2, 14 → 4, 18 → 4)', () => {
    expect(lowQuarterCount(10)).toBe(2);
    expect(lowQuarterCount(14)).toBe(4);
    expect(lowQuarterCount(18)).toBe(4);
    expect(lowQuarterCount(15)).toBe(4);
    expect(lowQuarterCount(4)).toBe(1);
  });

  it('when every can is equal, then DU is 1 and the multiplier is 1', () => {
    expect(lowQuarterUniformity([5, 5, 5, 5, 5, 5, 5, 5]).du).toBe(1);
    expect(schedulingMultiplier(1)).toBe(1);
    expect(auditedEfficiency(1)).toBe(1);
  });

  it('when catches are in mL, then depth = volume ÷ opening (1 in³ = 16.387064 mL)', () => {
    // A 3-inch throat has an opening of 7.0686 in²; 115.83 mL is 7.0686 in³, i.e. 1 inch.
    const area = throatAreaIn2(3, 'in');
    expect(area).toBeCloseTo(7.0686, 4);
    expect(catchDepthsIn([area * 16.387064], 'ml', { diameter: 3, unit: 'in' })[0]).toBeCloseTo(1, 10);
    expect(catchDepthsIn([25.4], 'mm')[0]).toBeCloseTo(1, 12);
    expect(() => catchDepthsIn([10], 'ml')).toThrow(/throat/);
  });

  it('when 0.25 in is caught in 15 minutes, then the rate is 1 in/h', () => {
    expect(catchCanPrecipitationRate([0.2, 0.3, 0.25], 15)).toBeCloseTo(1, 12);
  });

  it('when inputs are impossible, then it says which', () => {
    expect(() => lowQuarterUniformity([1, 2, 3])).toThrow(/at least 4/);
    expect(() => lowQuarterUniformity([0, 0, 0, 0])).toThrow(/empty/);
    expect(() => catchDepthsIn([-1], 'in')).toThrow(/Can 1/);
    expect(() => schedulingMultiplier(0)).toThrow(/DU_lq/);
    expect(() => catchCanPrecipitationRate([1], 0)).toThrow(/Run time/);
  });

  it('rates uniformity against a target', () => {
    expect(rateUniformity(0.7, 0.65)).toBe('good');
    expect(rateUniformity(0.55, 0.65)).toBe('fair');
    expect(rateUniformity(0.4, 0.65)).toBe('poor');
  });
});
