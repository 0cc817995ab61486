/**
 * Weighted least squares for small models (a handful of parameters), solved by Householder QR.
 *
 * QR rather than the normal equations because forming XᵀX squares the condition number: monthly ETo and an
 * intercept are strongly correlated, and daily data can have hundreds of rows.
 */

export interface LeastSquaresFit {
  coefficients: number[];
  /** (XᵀWX)⁻¹: multiply by the residual variance for the coefficients' covariance. */
  unscaledCovariance: number[][];
  /** Residual variance σ̂² = Σ wᵢ eᵢ² / (n − p), in the weighted (model) units. */
  residualVariance: number;
  /** Standard error of each coefficient, √(σ̂² · Cⱼⱼ). */
  standardErrors: number[];
}

/** Raised when a column is (nearly) a combination of the others, so its coefficient cannot be estimated. */
export class CollinearColumnsError extends RangeError {
  constructor(readonly columnIndex: number) {
    super(`Column ${columnIndex} is (nearly) a linear combination of the columns before it`);
    this.name = 'CollinearColumnsError';
  }
}

// With unit-length columns, |Rₖₖ| is the distance of column k from the span of the earlier ones; below this it
// carries no information a double can hold.
const COLLINEAR_TOLERANCE = 1e-9;

/**
 * Minimises Σ wᵢ (yᵢ − xᵢβ)². `design` holds one row per observation (include a column of ones for an intercept).
 * Weights default to 1 (ordinary least squares).
 */
export function solveLeastSquares(
  design: readonly (readonly number[])[],
  y: readonly number[],
  weights?: readonly number[],
): LeastSquaresFit {
  const n = design.length;
  const p = design[0]?.length ?? 0;
  if (p === 0) throw new RangeError('The design matrix has no columns');
  if (y.length !== n || (weights && weights.length !== n))
    throw new RangeError('Design rows, observations and weights must have the same length');
  if (n <= p)
    throw new RangeError(`Need more observations (${n}) than parameters (${p}) to estimate a residual variance`);
  for (const row of design)
    if (row.length !== p) throw new RangeError('Every design row must have the same number of columns');
  const all = [...y, ...design.flat(), ...(weights ?? [])];
  if (!all.every(Number.isFinite)) throw new RangeError('Design, observations and weights must be finite numbers');
  if (weights && !weights.every((w) => w > 0)) throw new RangeError('Weights must be positive');

  // Row weighting turns WLS into OLS on √w-scaled rows.
  const rootW = y.map((_, i) => Math.sqrt(weights?.[i] ?? 1));
  const a = design.map((row, i) => row.map((x) => x * rootW[i]!));
  const b = y.map((v, i) => v * rootW[i]!);

  // Unit-length columns make the collinearity test scale-free (ETo in mm, rain in mm, intercept of ones).
  const columnNorms = Array.from({ length: p }, (_, j) => Math.hypot(...a.map((row) => row[j]!)));
  columnNorms.forEach((norm, j) => {
    if (norm === 0) throw new CollinearColumnsError(j);
    for (const row of a) row[j] = row[j]! / norm;
  });

  const rDiagonal = householderInPlace(a, b);
  rDiagonal.forEach((r, k) => {
    if (Math.abs(r) < COLLINEAR_TOLERANCE) throw new CollinearColumnsError(k);
  });

  // Back-substitute R β = Qᵀb, then undo the column scaling.
  const scaledBeta = new Array<number>(p).fill(0);
  for (let k = p - 1; k >= 0; k--) {
    let sum = b[k]!;
    for (let j = k + 1; j < p; j++) sum -= a[k]![j]! * scaledBeta[j]!;
    scaledBeta[k] = sum / rDiagonal[k]!;
  }
  const coefficients = scaledBeta.map((beta, j) => beta / columnNorms[j]!);

  const rInverse = invertUpperTriangular(a, rDiagonal);
  const unscaledCovariance = Array.from({ length: p }, (_, i) =>
    Array.from({ length: p }, (_, j) => {
      let sum = 0;
      for (let k = Math.max(i, j); k < p; k++) sum += rInverse[i]![k]! * rInverse[j]![k]!;
      return sum / (columnNorms[i]! * columnNorms[j]!);
    }),
  );

  // Residuals from the original data, not from Qᵀb, so rounding in the factorisation does not hide in them.
  let weightedSse = 0;
  design.forEach((row, i) => {
    const e = y[i]! - row.reduce((sum, x, j) => sum + x * coefficients[j]!, 0);
    weightedSse += (weights?.[i] ?? 1) * e * e;
  });
  const residualVariance = weightedSse / (n - p);
  const standardErrors = unscaledCovariance.map((row, j) => Math.sqrt(residualVariance * row[j]!));
  return { coefficients, unscaledCovariance, residualVariance, standardErrors };
}

/**
 * Householder QR (as in JAMA's QRDecomposition): leaves R's strict upper triangle in `a`, returns R's diagonal,
 * and overwrites `b` with Qᵀb.
 */
function householderInPlace(a: number[][], b: number[]): number[] {
  const n = a.length;
  const p = a[0]!.length;
  const rDiagonal = new Array<number>(p).fill(0);
  for (let k = 0; k < p; k++) {
    let norm = 0;
    for (let i = k; i < n; i++) norm = Math.hypot(norm, a[i]![k]!);
    if (norm === 0) continue;
    // The sign choice avoids cancellation when forming the reflector.
    if (a[k]![k]! < 0) norm = -norm;
    for (let i = k; i < n; i++) a[i]![k] = a[i]![k]! / norm;
    a[k]![k] = a[k]![k]! + 1;
    const reflect = (get: (i: number) => number, set: (i: number, v: number) => void): void => {
      let s = 0;
      for (let i = k; i < n; i++) s += a[i]![k]! * get(i);
      s = -s / a[k]![k]!;
      for (let i = k; i < n; i++) set(i, get(i) + s * a[i]![k]!);
    };
    for (let j = k + 1; j < p; j++)
      reflect(
        (i) => a[i]![j]!,
        (i, v) => (a[i]![j] = v),
      );
    reflect(
      (i) => b[i]!,
      (i, v) => (b[i] = v),
    );
    rDiagonal[k] = -norm;
  }
  return rDiagonal;
}

/** R⁻¹ for the upper-triangular R held as (strict upper triangle of `a`, `diagonal`). */
function invertUpperTriangular(a: number[][], diagonal: number[]): number[][] {
  const p = diagonal.length;
  const inverse = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (let j = 0; j < p; j++) {
    inverse[j]![j] = 1 / diagonal[j]!;
    for (let i = j - 1; i >= 0; i--) {
      let sum = 0;
      for (let k = i + 1; k <= j; k++) sum += a[i]![k]! * inverse[k]![j]!;
      inverse[i]![j] = -sum / diagonal[i]!;
    }
  }
  return inverse;
}
