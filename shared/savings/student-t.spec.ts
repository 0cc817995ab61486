import { describe, expect, it } from 'vitest';
import { regularisedIncompleteBeta, studentTCdf, studentTQuantile, twoSidedT } from './student-t';

describe("Student's t", () => {
  it('when ν = 1 (Cauchy), then the CDF is ½ + atan(t)/π', () => {
    for (const t of [-30, -2, -0.3, 0, 0.7, 1, 5, 100])
      expect(studentTCdf(t, 1)).toBeCloseTo(0.5 + Math.atan(t) / Math.PI, 13);
  });

  it('when ν = 2, then the CDF is ½ + t/(2√(2 + t²)) and the quantile its inverse', () => {
    for (const t of [-4, -1, 0.5, 3, 12])
      expect(studentTCdf(t, 2)).toBeCloseTo(0.5 + t / (2 * Math.sqrt(2 + t * t)), 13);
    // Inverting by hand: t = (2p − 1)·√(2/(1 − (2p − 1)²)); p = 0.9 → 0.8·√(2/0.36).
    expect(studentTQuantile(0.9, 2)).toBeCloseTo(0.8 * Math.sqrt(2 / 0.36), 10);
  });

  it('when p < ½, then the quantile is the mirror image', () => {
    expect(studentTQuantile(0.1, 7)).toBeCloseTo(-studentTQuantile(0.9, 7), 12);
    expect(studentTQuantile(0.5, 7)).toBeCloseTo(0, 12);
  });

  it('when ν is very large, then it approaches the normal: 68 % two-sided → 0.9945, 95 % → 1.95996', () => {
    // Normal quantiles Φ⁻¹(0.84) = 0.994458 and Φ⁻¹(0.975) = 1.959964 (standard normal tables).
    expect(twoSidedT(0.68, 1e7)).toBeCloseTo(0.994458, 5);
    expect(twoSidedT(0.95, 1e7)).toBeCloseTo(1.959964, 5);
  });

  it('when a = b = 1, then the incomplete beta is the uniform CDF x; I_x(2, 1) = x²', () => {
    expect(regularisedIncompleteBeta(0.3, 1, 1)).toBeCloseTo(0.3, 14);
    expect(regularisedIncompleteBeta(0.3, 2, 1)).toBeCloseTo(0.09, 14);
  });

  it('when given impossible arguments, then it refuses', () => {
    expect(() => studentTQuantile(1, 5)).toThrow(RangeError);
    expect(() => studentTQuantile(0.9, 0)).toThrow(RangeError);
    expect(() => twoSidedT(1.2, 5)).toThrow(RangeError);
  });
});
