import { describe, expect, it } from 'vitest';
import { CollinearColumnsError, solveLeastSquares } from './least-squares';

describe('least squares by QR', () => {
  it('when y = 2 + 3x − 0.5z exactly, then it recovers those coefficients and no residual variance', () => {
    const rows = [
      [1, 0, 4],
      [1, 1, 2],
      [1, 2, 7],
      [1, 5, 1],
      [1, 3, 3],
      [1, 8, 0],
    ];
    const y = rows.map(([, x, z]) => 2 + 3 * x! - 0.5 * z!);
    const fit = solveLeastSquares(rows, y);
    expect(fit.coefficients[0]).toBeCloseTo(2, 10);
    expect(fit.coefficients[1]).toBeCloseTo(3, 10);
    expect(fit.coefficients[2]).toBeCloseTo(-0.5, 10);
    expect(fit.residualVariance).toBeLessThan(1e-20);
  });

  it(
    'when fitting x = 1..4, y = 2, 4.1, 5.9, 8.2, then slope, intercept ' + 'and (XᵀX)⁻¹ match the hand calculation',
    () => {
      // x̄ = 2.5, ȳ = 5.05, Sxy = 10.2, Sxx = 5 → slope 2.04, intercept 5.05 − 2.04·2.5 = −0.05.
      // XᵀX = [[4, 10], [10, 30]], det 20 → inverse [[1.5, −0.5], [−0.5, 0.2]].
      // Residuals −0.09, 0.17, −0.07, −0.01 → SSE 0.042, σ̂² = 0.042/2 = 0.021.
      const fit = solveLeastSquares(
        [
          [1, 1],
          [1, 2],
          [1, 3],
          [1, 4],
        ],
        [2, 4.1, 5.9, 8.2],
      );
      expect(fit.coefficients[0]).toBeCloseTo(-0.05, 12);
      expect(fit.coefficients[1]).toBeCloseTo(2.04, 12);
      expect(fit.unscaledCovariance[0]![0]).toBeCloseTo(1.5, 12);
      expect(fit.unscaledCovariance[0]![1]).toBeCloseTo(-0.5, 12);
      expect(fit.unscaledCovariance[1]![0]).toBeCloseTo(-0.5, 12);
      expect(fit.unscaledCovariance[1]![1]).toBeCloseTo(0.2, 12);
      expect(fit.residualVariance).toBeCloseTo(0.021, 12);
      expect(fit.standardErrors[1]).toBeCloseTo(Math.sqrt(0.021 * 0.2), 12);
    },
  );

  it('when a row has weight 2, then it fits exactly as if the row were given twice', () => {
    const rows = [
      [1, 1],
      [1, 2],
      [1, 4],
      [1, 7],
    ];
    const y = [3, 4, 9, 12];
    const weighted = solveLeastSquares(rows, y, [1, 2, 1, 1]);
    const duplicated = solveLeastSquares([...rows, rows[1]!], [...y, y[1]!]);
    expect(weighted.coefficients[0]).toBeCloseTo(duplicated.coefficients[0]!, 12);
    expect(weighted.coefficients[1]).toBeCloseTo(duplicated.coefficients[1]!, 12);
  });

  it('when x sits far from zero (1e6 + i), then the slope stays exact where the normal equations would lose it', () => {
    // XᵀX here has a condition number near 1e13; forming it loses about 13 of the 16 digits.
    const xs = Array.from({ length: 10 }, (_, i) => 1e6 + i);
    const fit = solveLeastSquares(
      xs.map((x) => [1, x]),
      xs.map((x) => 3 + 2 * x + (x % 2 === 0 ? 0.25 : -0.25)),
    );
    // Hand: Sxx = Σ(i − 4.5)² = 82.5; the ±0.25 noise (+ on even i) gives Σ(i − 4.5)eᵢ = −1.25 → slope 2 − 1.25/82.5.
    expect(fit.coefficients[1]).toBeCloseTo(2 - 1.25 / 82.5, 8);
  });

  it('when a column copies another, then it names that column as collinear', () => {
    const rows = [
      [1, 2, 4],
      [1, 3, 6],
      [1, 5, 10],
      [1, 1, 2],
    ];
    expect(() => solveLeastSquares(rows, [1, 2, 3, 4])).toThrow(CollinearColumnsError);
    try {
      solveLeastSquares(rows, [1, 2, 3, 4]);
    } catch (error) {
      expect((error as CollinearColumnsError).columnIndex).toBe(2);
    }
  });

  it('when a column is all zeros, then it is reported rather than divided by', () => {
    expect(() =>
      solveLeastSquares(
        [
          [1, 0],
          [1, 0],
          [1, 0],
        ],
        [1, 2, 3],
      ),
    ).toThrow(CollinearColumnsError);
  });

  it('when there are no more rows than parameters, then it refuses', () => {
    expect(() =>
      solveLeastSquares(
        [
          [1, 1],
          [1, 2],
        ],
        [1, 2],
      ),
    ).toThrow(/more observations/);
  });

  it('when inputs are not finite or weights not positive, then it refuses', () => {
    expect(() =>
      solveLeastSquares(
        [
          [1, 1],
          [1, Number.NaN],
          [1, 3],
        ],
        [1, 2, 3],
      ),
    ).toThrow(/finite/);
    expect(() =>
      solveLeastSquares(
        [
          [1, 1],
          [1, 2],
          [1, 3],
        ],
        [1, 2, 3],
        [1, 0, 1],
      ),
    ).toThrow(/positive/);
  });
});
