import { describe, expect, it } from 'vitest';
import { estimateControllerShiftMinutes } from './controller-clock-skew';
import { HOUR_MS } from './site-clock';
import { hours, repeat, run, T0, testZones } from './watch-test-input';

const DAY = 24 * HOUR_MS;

describe('estimateControllerShiftMinutes', () => {
  // Zone A (10 gpm) really waters 21:50–22:30 each night: 100 gal in hour 21, 300 in hour 22.
  const meter = hours(T0, Array.from({ length: 5 }, () => [...repeat(0, 21), 100, 300, 0]).flat());

  it("finds how far the controller's stamps are off the meter's clock", () => {
    // The controller thinks it started at 22:00, ten minutes late.
    const runs = [0, 1, 2, 3, 4].map((d) => run('A', T0 + d * DAY + 22 * HOUR_MS, 40));
    expect(estimateControllerShiftMinutes(meter, runs, testZones, 15)).toBe(-10);
  });

  it('leaves aligned clocks alone, and does nothing when the search is off', () => {
    const runs = [0, 1, 2, 3, 4].map((d) => run('A', T0 + d * DAY + 21 * HOUR_MS + 50 * 60_000, 40));
    expect(estimateControllerShiftMinutes(meter, runs, testZones, 15)).toBe(0);
    const late = runs.map((r) => ({ ...r, startUtc: r.startUtc + 10 * 60_000 }));
    expect(estimateControllerShiftMinutes(meter, late, testZones, 0)).toBe(0);
  });
});
