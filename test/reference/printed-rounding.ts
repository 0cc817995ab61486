import { expect } from 'vitest';

/**
 * Asserts that `actual` agrees with a value printed to `decimals` places: |actual − printed| ≤ half a unit in the
 * last printed place (plus float slack). This is how docs/references.md asks published values to be compared.
 */
export function expectPrinted(actual: number, printed: number, decimals: number): void {
  const tolerance = 0.5 * Math.pow(10, -decimals) + 1e-9;
  expect(Math.abs(actual - printed), `${actual} vs printed ${printed} (±${tolerance})`).toBeLessThanOrEqual(tolerance);
}
