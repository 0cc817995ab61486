/**
 * Savings statistics (issue #7) checked against docs/references.md §6 (ASHRAE Guideline 14, IPMVP Option C) and against
 * independent general-purpose statistics libraries run on the same invented data:
 *   - simple-statistics (linearRegression, rSquared, mean) for the one-variable model;
 *   - ml-regression-multivariate-linear (normal equations through an SVD inverse) for the multi-variable models,
 *     their standard errors and the prediction variance;
 *   - jstat for Student's t quantiles.
 * Our solver is Householder QR, so agreement is between two different numerical routes.
 */
import { createRequire } from 'node:module';
import MultivariateLinearRegression from 'ml-regression-multivariate-linear';
import { linearRegression, linearRegressionLine, mean, rSquared, sampleCorrelation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { fitBaselineModel, type MeteredPeriod } from '../../shared/savings/baseline-model';
import { fitStatistics } from '../../shared/savings/fit-statistics';
import { calculateSavings } from '../../shared/savings/savings-calculation';
import {
  CV_RMSE_LIMITS,
  MAX_ABS_NMBE_PERCENT,
  MAX_FRACTIONAL_UNCERTAINTY,
  MIN_BASELINE_DAYS,
  MIN_SAVINGS_PERCENT,
  UNCERTAINTY_CONFIDENCE,
} from '../../shared/savings/savings-verdict';
import { studentTQuantile } from '../../shared/savings/student-t';
import { expectPrinted } from './printed-rounding';

// jstat ships no type declarations; only this one function is used.
const { jStat } = createRequire(import.meta.url)('jstat') as {
  jStat: { studentt: { inv(p: number, dof: number): number } };
};

// Invented baseline year for one site (use typed in by hand, not generated from a formula).
const baseline: MeteredPeriod[] = [
  ['Jan', 31, 48, 96, 21_300],
  ['Feb', 28, 61, 74, 26_900],
  ['Mar', 31, 97, 55, 43_800],
  ['Apr', 30, 128, 22, 56_100],
  ['May', 31, 151, 9, 66_400],
  ['Jun', 30, 178, 2, 72_900],
  ['Jul', 31, 193, 0, 80_200],
  ['Aug', 31, 168, 1, 71_500],
  ['Sep', 30, 133, 6, 57_700],
  ['Oct', 31, 88, 24, 38_600],
  ['Nov', 30, 57, 49, 25_100],
  ['Dec', 31, 44, 88, 19_800],
].map(([label, days, etoMm, rainMm, useGal]) => ({
  label: String(label),
  days: Number(days),
  etoMm: Number(etoMm),
  rainMm: Number(rainMm),
  useGal: Number(useGal),
}));
const use = baseline.map((p) => p.useGal);

describe('one-variable baseline (use ~ a + b·ETo) against simple-statistics', () => {
  const model = fitBaselineModel(baseline, 'eto');
  const pairs = baseline.map((p) => [p.etoMm, p.useGal]);
  const library = linearRegression(pairs);

  it('slope and intercept agree with simple-statistics linearRegression', () => {
    expect(model.coefficients[1]!.value).toBeCloseTo(library.m, 8); // simple-statistics 7.12 linearRegression
    expect(model.coefficients[0]!.value).toBeCloseTo(library.b, 6); // simple-statistics 7.12 linearRegression
  });

  it('R² agrees with simple-statistics rSquared', () => {
    // simple-statistics 7.12 rSquared
    expect(model.statistics.rSquared!).toBeCloseTo(rSquared(pairs, linearRegressionLine(library)), 12);
  });

  it('mean use agrees with simple-statistics mean', () => {
    expect(model.statistics.meanActual).toBeCloseTo(mean(use), 9); // simple-statistics 7.12 mean
  });
});

describe('two-variable baseline (use ~ a + b·ETo + c·rain) against ml-regression-multivariate-linear', () => {
  const model = fitBaselineModel(baseline, 'eto-rain');
  const library = new MultivariateLinearRegression(
    baseline.map((p) => [p.etoMm, p.rainMm]),
    use.map((y) => [y]),
  );
  // The library appends its intercept column last: weights are [ETo, rain, intercept].
  const [eto, rain, intercept] = library.weights.map((w) => w[0]!);

  it('coefficients agree', () => {
    expect(model.coefficients[0]!.value).toBeCloseTo(intercept!, 5); // ml-regression-multivariate-linear 2.0.4 weights
    expect(model.coefficients[1]!.value).toBeCloseTo(eto!, 8); // ml-regression-multivariate-linear 2.0.4 weights
    expect(model.coefficients[2]!.value).toBeCloseTo(rain!, 8); // ml-regression-multivariate-linear 2.0.4 weights
  });

  it('standard errors agree', () => {
    const [seEto, seRain, seIntercept] = library.stdErrors;
    // ml-regression-multivariate-linear stdErrors
    expect(model.coefficients[0]!.standardError).toBeCloseTo(seIntercept!, 5);
    expect(model.coefficients[1]!.standardError).toBeCloseTo(seEto!, 8); // ml-regression-multivariate-linear stdErrors
    expect(model.coefficients[2]!.standardError).toBeCloseTo(seRain!, 8); // ml-regression-multivariate-linear stdErrors
  });

  it(
    "R² agrees with the squared correlation of use and the library's " +
      'predictions (simple-statistics sampleCorrelation)',
    () => {
      const predicted = baseline.map((p) => library.predict([p.etoMm, p.rainMm])[0]!);
      // With an intercept, OLS R² equals corr(y, ŷ)².
      // simple-statistics sampleCorrelation
      expect(model.statistics.rSquared!).toBeCloseTo(sampleCorrelation(use, predicted) ** 2, 10);
    },
  );

  it("CV(RMSE) agrees with 100 × the library's residual standard error / mean use (both use n − p)", () => {
    // ml-regression stdError; G14 CV(RMSE) definition, from memory (docs/references.md §6)
    expect(model.statistics.cvRmsePercent).toBeCloseTo((100 * library.stdError) / mean(use), 9);
  });

  it(
    'the variance of a predicted reporting total agrees with one ' + "built from the library's coefficient covariance",
    () => {
      // Var(total) = gᵀ·Cov(β)·g + m·σ̂², g = summed design rows of the reporting months.
      const reporting = baseline.map((p) => ({ ...p, etoMm: p.etoMm + 7, useGal: 0.75 * p.useGal }));
      const savings = calculateSavings(model, reporting, { confidence: UNCERTAINTY_CONFIDENCE });
      const g = [
        reporting.reduce((s, p) => s + p.etoMm, 0),
        reporting.reduce((s, p) => s + p.rainMm, 0),
        reporting.length,
      ];
      const cov = library.stdErrorMatrix.to2DArray();
      const quadratic = g.reduce((sum, gi, i) => sum + g.reduce((inner, gj, j) => inner + gi * cov[i]![j]! * gj, 0), 0);
      const variance = quadratic + reporting.length * library.stdError ** 2;
      // ml-regression-multivariate-linear stdErrorMatrix
      expect(savings.uncertainty.standardErrorGal).toBeCloseTo(Math.sqrt(variance), 4);
      // And the ±interval uses jstat's t at 68 % with n − p = 9 degrees of freedom.
      // jstat 1.9.6 studentt.inv
      expect(savings.uncertainty.plusMinusGal).toBeCloseTo(jStat.studentt.inv(0.84, 9) * Math.sqrt(variance), 4);
    },
  );
});

describe('per-day baseline, weighted by days, against ml-regression-multivariate-linear on √days-scaled rows', () => {
  it('coefficients agree', () => {
    const model = fitBaselineModel(baseline, 'eto-rain-per-day');
    // Weighted least squares is ordinary least squares on rows multiplied by √weight; the intercept column becomes
    // √days.
    const rows = baseline.map((p) => [
      Math.sqrt(p.days),
      (p.etoMm / p.days) * Math.sqrt(p.days),
      (p.rainMm / p.days) * Math.sqrt(p.days),
    ]);
    const library = new MultivariateLinearRegression(
      rows,
      baseline.map((p) => [(p.useGal / p.days) * Math.sqrt(p.days)]),
      { intercept: false },
    );
    // ml-regression-multivariate-linear 2.0.4 weights
    library.weights.forEach(([w], j) => expect(model.coefficients[j]!.value).toBeCloseTo(w!, 6));
  });
});

describe('daily baseline (365 rows) against ml-regression-multivariate-linear', () => {
  it('coefficients agree at daily scale', () => {
    // Invented daily weather and use from smooth seasonal curves plus a fixed wobble.
    const days: MeteredPeriod[] = Array.from({ length: 365 }, (_, d) => {
      const season = Math.sin((2 * Math.PI * (d - 80)) / 365);
      const etoMm = 4 + 3 * season + 0.4 * Math.sin(d * 1.7);
      const rainMm = Math.max(0, -6 * season + 2 * Math.cos(d * 2.3));
      return {
        label: `d${d + 1}`,
        days: 1,
        etoMm,
        rainMm,
        useGal: 150 + 380 * etoMm - 40 * rainMm + 120 * Math.sin(d * 0.9),
      };
    });
    const model = fitBaselineModel(days, 'eto-rain');
    const library = new MultivariateLinearRegression(
      days.map((p) => [p.etoMm, p.rainMm]),
      days.map((p) => [p.useGal]),
    );
    const [eto, rain, intercept] = library.weights.map((w) => w[0]!);
    expect(model.coefficients[0]!.value).toBeCloseTo(intercept!, 6); // ml-regression-multivariate-linear 2.0.4 weights
    expect(model.coefficients[1]!.value).toBeCloseTo(eto!, 6); // ml-regression-multivariate-linear 2.0.4 weights
    expect(model.coefficients[2]!.value).toBeCloseTo(rain!, 6); // ml-regression-multivariate-linear 2.0.4 weights
  });
});

describe('docs/references.md §6 computed test vector (derived there, not published)', () => {
  const y = [100, 110, 95, 120, 130, 90, 85, 105, 115, 125, 98, 102];
  const fitted = [98, 112, 97, 118, 127, 93, 88, 103, 113, 128, 99, 100];
  const stats = fitStatistics(y, fitted, 1);

  it('ȳ = 106.25, CV(RMSE) = 2.288 %, NMBE = −0.0856 % with p = 1 (sign y − ŷ)', () => {
    expect(stats.meanActual).toBe(106.25); // docs/references.md §6 computed vector (derived, not published)
    // docs/references.md §6 computed vector (derived, not published); G14 formula from memory
    expectPrinted(stats.cvRmsePercent, 2.288, 3);
    // docs/references.md §6 computed vector (derived, not published); G14 formula from memory
    expectPrinted(stats.nmbePercent, -0.0856, 4);
  });
});

describe("Student's t quantiles", () => {
  it('agree with jstat studentt.inv', () => {
    for (const dof of [1, 2, 5, 9, 10, 22, 120, 364]) {
      for (const p of [0.6, 0.84, 0.9, 0.95, 0.975, 0.995]) {
        // jstat's inverse is good to about 1e-7 (at p = 0.95, ν = 120 it is 6e-8 below SciPy's), hence 6 places.
        expect(studentTQuantile(p, dof)).toBeCloseTo(jStat.studentt.inv(p, dof), 6); // jstat 1.9.6 studentt.inv
      }
    }
  });

  it('agree with SciPy where jstat is least precise', () => {
    // scipy.stats.t.ppf(0.95, 120) = 1.6576508993552352, run outside this project (SciPy 1.17.1).
    expect(studentTQuantile(0.95, 120)).toBeCloseTo(1.6576508993552352, 11); // SciPy t.ppf
  });

  it('agree with printed t-table values', () => {
    // Standard two-sided t-table values (e.g. NIST/SEMATECH e-Handbook §1.3.6.7.2) — from memory.
    expectPrinted(studentTQuantile(0.975, 1), 12.706, 3); // t-table, from memory
    expectPrinted(studentTQuantile(0.975, 5), 2.571, 3); // t-table, from memory
    expectPrinted(studentTQuantile(0.975, 10), 2.228, 3); // t-table, from memory
    expectPrinted(studentTQuantile(0.95, 10), 1.812, 3); // t-table, from memory
    expectPrinted(studentTQuantile(0.975, 30), 2.042, 3); // t-table, from memory
  });
});

describe('Guideline 14 and IPMVP thresholds (docs/references.md §6)', () => {
  it('whole-building regression CV(RMSE): 20 % under 12 months, 25 % for 12–60, 30 % beyond', () => {
    expect(CV_RMSE_LIMITS.map((l) => l.maxPercent)).toEqual([20, 25, 30]); // G14-2002 §5.2.11, from memory
    // G14-2002 §5.2.11, from memory
    expect(CV_RMSE_LIMITS.map((l) => l.reportingMonthsAtMost)).toEqual([11, 60, Number.POSITIVE_INFINITY]);
  });

  it('net determination bias ≤ 0.005 %, savings > 10 %, otherwise FSU < 50 % at 68 % confidence', () => {
    expect(MAX_ABS_NMBE_PERCENT).toBe(0.005); // G14-2002 §5.2.11, from memory
    expect(MIN_SAVINGS_PERCENT).toBe(10); // G14-2002 §5.2.11, from memory
    expect(MAX_FRACTIONAL_UNCERTAINTY).toBe(0.5); // G14-2002 §5.2.11, from memory
    expect(UNCERTAINTY_CONFIDENCE).toBe(0.68); // G14-2002 §5.2.11, from memory
  });

  it('a baseline of about 12 months (a full operating cycle)', () => {
    // Our cut-off allows for bill dates: twelve monthly reads total 360–366 days, eleven at most ~337.
    expect(MIN_BASELINE_DAYS).toBeGreaterThan(337); // IPMVP Core Concepts, Option C, from memory
    expect(MIN_BASELINE_DAYS).toBeLessThanOrEqual(360); // IPMVP Core Concepts, Option C, from memory
  });
});
