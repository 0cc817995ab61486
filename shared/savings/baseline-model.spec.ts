import { describe, expect, it } from 'vitest';
import { fitBaselineModel, predictBaseline, type MeteredPeriod } from './baseline-model';

// An invented site-year: monthly ETo and rain (mm) of a dry-summer climate; use built from known coefficients.
const DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
const ETO = [50, 65, 95, 125, 155, 175, 190, 170, 130, 90, 60, 45];
const RAIN = [90, 80, 60, 25, 8, 1, 0, 0, 5, 20, 50, 85];
// Fixed ±noise, zero-sum, so fits are not exact but stay close to the truth.
const NOISE = [900, -1200, 400, -300, 1500, -800, -600, 1100, -700, 200, -900, 400];

function year(use: (i: number) => number): MeteredPeriod[] {
  return DAYS.map((days, i) => ({ label: `M${i + 1}`, days, etoMm: ETO[i]!, rainMm: RAIN[i]!, useGal: use(i) }));
}

describe('baseline model', () => {
  it('when use = 2,000 + 400·ETo − 120·rain exactly, then the ETo + rain model recovers it with CV(RMSE) ≈ 0', () => {
    const model = fitBaselineModel(
      year((i) => 2000 + 400 * ETO[i]! - 120 * RAIN[i]!),
      'eto-rain',
    );
    expect(model.coefficients.map((c) => c.term)).toEqual(['base use', 'ETo', 'rain']);
    expect(model.coefficients[0]!.value).toBeCloseTo(2000, 6);
    expect(model.coefficients[1]!.value).toBeCloseTo(400, 8);
    expect(model.coefficients[2]!.value).toBeCloseTo(-120, 8);
    expect(model.statistics.cvRmsePercent).toBeLessThan(1e-9);
    expect(model.statistics.rSquared).toBeCloseTo(1, 12);
    expect(model.statistics.p).toBe(3);
    expect(model.baselineDays).toBe(365);
  });

  it('when use is noisy, then the coefficients stay near the truth and the fitted values leave NMBE ≈ 0', () => {
    const model = fitBaselineModel(
      year((i) => 2000 + 400 * ETO[i]! - 120 * RAIN[i]! + NOISE[i]!),
      'eto-rain',
    );
    expect(Math.abs(model.coefficients[1]!.value - 400)).toBeLessThan(3 * model.coefficients[1]!.standardError);
    expect(model.statistics.cvRmsePercent).toBeGreaterThan(0.5);
    // OLS with an intercept makes the residuals sum to zero, whatever the data.
    expect(Math.abs(model.statistics.nmbePercent)).toBeLessThan(1e-9);
    const residualSum = model.periods.reduce((sum, p) => sum + p.residualGal, 0);
    expect(Math.abs(residualSum)).toBeLessThan(1e-6);
  });

  it('when the per-day model sees use = 60 gal/day + 400·ETo exactly, then it recovers the per-day base use', () => {
    const model = fitBaselineModel(
      year((i) => 60 * DAYS[i]! + 400 * ETO[i]!),
      'eto-per-day',
    );
    expect(model.coefficients[0]).toMatchObject({ term: 'base use', unit: 'gal/day' });
    expect(model.coefficients[0]!.value).toBeCloseTo(60, 8);
    expect(model.coefficients[1]!.value).toBeCloseTo(400, 8);
  });

  it(
    'when the per-day model is fitted to noisy totals, then weighting ' +
      'by days keeps the totals unbiased (NMBE ≈ 0)',
    () => {
      const model = fitBaselineModel(
        year((i) => 60 * DAYS[i]! + 400 * ETO[i]! - 100 * RAIN[i]! + NOISE[i]!),
        'eto-rain-per-day',
      );
      expect(Math.abs(model.statistics.nmbePercent)).toBeLessThan(1e-9);
      expect(model.statistics.cvRmsePercent).toBeGreaterThan(0.5);
    },
  );

  it('when predicting the baseline weather, then the prediction equals the fitted values', () => {
    const baseline = year((i) => 2000 + 400 * ETO[i]! - 120 * RAIN[i]! + NOISE[i]!);
    const model = fitBaselineModel(baseline, 'eto-rain');
    const prediction = predictBaseline(model, baseline);
    prediction.perPeriodGal.forEach((gal, i) => expect(gal).toBeCloseTo(model.periods[i]!.fittedGal, 6));
    expect(prediction.totalVarianceGal2).toBeGreaterThan(0);
  });

  it('when the baseline never rains, then the rain model says so plainly instead of dividing by zero', () => {
    const dry = year((i) => 2000 + 400 * ETO[i]!).map((p) => ({ ...p, rainMm: 0 }));
    expect(() => fitBaselineModel(dry, 'eto-rain')).toThrow(/effect of rain.*model without rain/);
    expect(() => fitBaselineModel(dry, 'eto')).not.toThrow();
  });

  it('when a period has impossible values, then it names the period', () => {
    const bad = year(() => 1000);
    bad[3] = { ...bad[3]!, etoMm: -1 };
    expect(() => fitBaselineModel(bad, 'eto')).toThrow(/M4/);
    const zeroDays = year(() => 1000);
    zeroDays[0] = { ...zeroDays[0]!, days: 0 };
    expect(() => fitBaselineModel(zeroDays, 'eto-per-day')).toThrow(/M1.*days/);
  });
});
