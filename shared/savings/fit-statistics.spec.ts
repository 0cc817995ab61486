import { describe, expect, it } from 'vitest';
import { fitStatistics, lagOneAutocorrelation } from './fit-statistics';

// Hand case: y = 10, 20, 30; ŷ = 11, 19, 33 → residuals −1, 1, −3; Σe = −3; SSE = 11; ȳ = 20; SST = 200.
const actual = [10, 20, 30];
const fitted = [11, 19, 33];

describe('Guideline 14 fit statistics', () => {
  it('when p = 1, then CV(RMSE) = 100·√(11/2)/20 and NMBE = 100·(−3)/(2·20) = −7.5 %', () => {
    const stats = fitStatistics(actual, fitted, 1);
    expect(stats.meanActual).toBe(20);
    expect(stats.rmse).toBeCloseTo(Math.sqrt(5.5), 12);
    expect(stats.cvRmsePercent).toBeCloseTo((100 * Math.sqrt(5.5)) / 20, 12);
    expect(stats.nmbePercent).toBeCloseTo(-7.5, 12);
    expect(stats.rSquared).toBeCloseTo(1 - 11 / 200, 12);
    expect(stats.adjustedRSquared).toBeCloseTo(1 - 11 / 200, 12); // (n − 1)/(n − p) = 1
  });

  it('when p = 2, then the n − p divisor shrinks to 1: CV(RMSE) = 100·√11/20, NMBE = −15 %, adjusted R² = 0.89', () => {
    const stats = fitStatistics(actual, fitted, 2);
    expect(stats.cvRmsePercent).toBeCloseTo((100 * Math.sqrt(11)) / 20, 12);
    expect(stats.nmbePercent).toBeCloseTo(-15, 12);
    expect(stats.adjustedRSquared).toBeCloseTo(1 - 0.055 * 2, 12);
  });

  it('when use never varies, then R² is null rather than 0/0', () => {
    const stats = fitStatistics([5, 5, 5], [5, 5, 5], 1);
    expect(stats.rSquared).toBeNull();
    expect(stats.cvRmsePercent).toBe(0);
  });

  it('when mean use is zero or there are too few points, then it refuses', () => {
    expect(() => fitStatistics([0, 0, 0], [0, 0, 0], 1)).toThrow(/positive/);
    expect(() => fitStatistics([1, 2], [1, 2], 2)).toThrow(/more observations/);
    expect(() => fitStatistics([1, 2, 3], [1, 2], 1)).toThrow(/same length/);
  });
});

describe('lag-1 autocorrelation of residuals', () => {
  it('when residuals alternate 1, −1, 1, −1, then it is −3/4', () => {
    expect(lagOneAutocorrelation([1, -1, 1, -1])).toBeCloseTo(-0.75, 12);
  });

  it('when residuals drift 1, 2, 3, 4, 5, then it is (Σ dᵢdᵢ₋₁ = 4)/(Σ dᵢ² = 10) = 0.4', () => {
    // Deviations −2, −1, 0, 1, 2: products 2, 0, 0, 2.
    expect(lagOneAutocorrelation([1, 2, 3, 4, 5])).toBeCloseTo(0.4, 12);
  });

  it('when there are fewer than 3 residuals or none vary, then it is null', () => {
    expect(lagOneAutocorrelation([1, 2])).toBeNull();
    expect(lagOneAutocorrelation([2, 2, 2])).toBeNull();
  });
});
