/**
 * Irrigation formula checks (docs/references.md §4).
 */
import { describe, expect, it } from 'vitest';
import {
  PRECIPITATION_RATE_CONSTANT,
  precipitationRateInPerHour,
  spacingPrecipitationRateInPerHour,
} from '../../shared/budgets/run-time-advice';
import { expectPrinted } from './printed-rounding';

describe('precipitation rate', () => {
  it('the constant is 96.25 = 60 × 12 / 7.48', () => {
    // Kitsap PUD kpud.org/sprinklerRates.php; 720/7.480519 = 96.2500 (derived)
    expectPrinted(PRECIPITATION_RATE_CONSTANT, 96.25, 4);
  });

  it('10 GPM over 1,000 ft² → 0.9625 in/h', () => {
    expectPrinted(precipitationRateInPerHour(10, 1_000), 0.9625, 4); // Kitsap PUD kpud.org/sprinklerRates.php
  });

  it('60 × 15 ft, 6 half-circle heads at 1.0 GPM and 4 quarter-circle at 0.5 GPM → 0.856 in/h', () => {
    const gpm = 6 * 1.0 + 4 * 0.5;
    expect(gpm).toBe(8);
    // irrigation course slides (docs/references.md §4), printed 0.86 (0.856)
    expectPrinted(precipitationRateInPerHour(gpm, 60 * 15), 0.856, 3);
    // irrigation course slides (docs/references.md §4)
    expectPrinted(precipitationRateInPerHour(gpm, 60 * 15), 0.86, 2);
  });

  it('triangular spacing: 6 GPM full circle, 25 × 30 ft → 0.889 in/h', () => {
    // irrigation course slides (docs/references.md §4), published + derived
    expectPrinted(spacingPrecipitationRateInPerHour(6, 25, 30, 'triangular'), 0.889, 3);
  });

  it('square spacing is the plain area formula', () => {
    // Same formula as the area method for one head's share: 96.25 × 6 / 750 (docs/references.md §4 square form).
    expectPrinted(spacingPrecipitationRateInPerHour(6, 25, 30, 'square'), 0.77, 4);
  });
});
