/**
 * Goodness-of-fit statistics for a baseline model, as ASHRAE Guideline 14 defines them (docs/references.md §6, from
 * memory: G14-2002 eqs. 5.4–5.5 per secondary sources). Both divide by n − p, the residual degrees of freedom.
 */

export interface FitStatistics {
  /** Number of observations. */
  n: number;
  /** Number of model parameters, intercept included. */
  p: number;
  meanActual: number;
  /** 1 − SSres/SStot; null when the actual use never varies, so there is nothing to explain. */
  rSquared: number | null;
  /** R² penalised for parameters: 1 − (1 − R²)(n − 1)/(n − p). */
  adjustedRSquared: number | null;
  /** √(SSres/(n − p)), in the units of use. */
  rmse: number;
  /** 100 · RMSE / ȳ, percent. */
  cvRmsePercent: number;
  /** 100 · Σ(yᵢ − ŷᵢ) / ((n − p) · ȳ), percent; positive when the model under-predicts. */
  nmbePercent: number;
}

export function fitStatistics(
  actual: readonly number[],
  fitted: readonly number[],
  parameterCount: number,
): FitStatistics {
  const n = actual.length;
  const p = parameterCount;
  if (fitted.length !== n) throw new RangeError('Actual and fitted values must have the same length');
  if (!Number.isInteger(p) || p < 1) throw new RangeError('The parameter count must be a whole number, 1 or more');
  if (n <= p) throw new RangeError(`Need more observations (${n}) than parameters (${p})`);
  const meanActual = actual.reduce((sum, y) => sum + y, 0) / n;
  // CV and NMBE are relative to mean use; with no use they mean nothing.
  if (!(meanActual > 0)) throw new RangeError('Mean actual use must be positive to express CV(RMSE) and NMBE');

  let sumResiduals = 0;
  let sse = 0;
  let sst = 0;
  for (let i = 0; i < n; i++) {
    const residual = actual[i]! - fitted[i]!;
    sumResiduals += residual;
    sse += residual * residual;
    sst += (actual[i]! - meanActual) ** 2;
  }
  const rSquared = sst > 0 ? 1 - sse / sst : null;
  const adjustedRSquared = rSquared === null ? null : 1 - ((1 - rSquared) * (n - 1)) / (n - p);
  const rmse = Math.sqrt(sse / (n - p));
  return {
    n,
    p,
    meanActual,
    rSquared,
    adjustedRSquared,
    rmse,
    cvRmsePercent: (100 * rmse) / meanActual,
    nmbePercent: (100 * sumResiduals) / ((n - p) * meanActual),
  };
}

/**
 * Lag-1 autocorrelation of residuals in time order. The savings uncertainty assumes independent residuals; daily
 * models usually break that, and a high value says the stated uncertainty is too small.
 */
export function lagOneAutocorrelation(residuals: readonly number[]): number | null {
  const n = residuals.length;
  if (n < 3) return null;
  const mean = residuals.reduce((sum, e) => sum + e, 0) / n;
  let numerator = 0;
  let denominator = 0;
  for (let i = 0; i < n; i++) {
    const d = residuals[i]! - mean;
    denominator += d * d;
    if (i > 0) numerator += d * (residuals[i - 1]! - mean);
  }
  return denominator > 0 ? numerator / denominator : null;
}
