import { describe, expect, it } from 'vitest';
import { buildTimeline } from './hour-timeline';
import { HOUR_MS } from './site-clock';
import { detectNoReads, detectZeroWhileRunning } from './silent-meter-detection';
import { hours, repeat, run, T0, testContext, testZones } from './watch-test-input';

const DAY = 24 * HOUR_MS;

describe('detectNoReads', () => {
  it('flags 50 silent hours between readings, but not 47', () => {
    const ctx = { ...testContext(), asOfUtc: T0 + 160 * HOUR_MS };
    const long = detectNoReads(
      buildTimeline(hours(T0, [1, ...repeat(null, 50), ...repeat(1, 100)]), [], testZones, 'UTC'),
      ctx,
    );
    expect(long).toHaveLength(1);
    expect(long[0]).toMatchObject({
      subKind: 'no-reads',
      periodStartUtc: T0 + HOUR_MS,
      periodEndUtc: T0 + 51 * HOUR_MS,
      ongoing: false,
      waterLostGal: null,
      severity: 'act-soon',
    });
    expect(
      detectNoReads(buildTimeline(hours(T0, [1, ...repeat(null, 47), ...repeat(1, 150)]), [], testZones, 'UTC'), ctx),
    ).toEqual([]);
  });

  it('flags a meter that is still silent now', () => {
    const ctx = { ...testContext(), asOfUtc: T0 + 100 * HOUR_MS };
    const [f] = detectNoReads(buildTimeline(hours(T0, repeat(1, 40)), [], testZones, 'UTC'), ctx);
    expect(f).toMatchObject({ periodStartUtc: T0 + 40 * HOUR_MS, periodEndUtc: T0 + 100 * HOUR_MS, ongoing: true });
  });
});

describe('detectZeroWhileRunning', () => {
  /** Zone A waters 30 min (300 gal) at 22:00 each night; the meter reads `metered(d)` that hour. */
  function nights(count: number, metered: (d: number) => number, cause: 'scheduled' | 'skipped-rain' = 'scheduled') {
    const values: number[] = [];
    const runs = [];
    for (let d = 0; d < count; d++) {
      values.push(...repeat(0, 22), metered(d), 0);
      runs.push(run('A', T0 + d * DAY + 22 * HOUR_MS, 30, { cause }));
    }
    return buildTimeline(hours(T0, values), runs, testZones, 'UTC');
  }

  it('flags two watering days in a row on which the meter stayed at zero', () => {
    const [f, ...rest] = detectZeroWhileRunning(
      nights(6, (d) => (d >= 3 ? 0 : 300)),
      testContext(),
    );
    expect(rest).toEqual([]);
    expect(f).toMatchObject({
      subKind: 'zero-while-running',
      periodStartUtc: T0 + 3 * DAY + 22 * HOUR_MS,
      ongoing: true,
      waterLostGal: null,
    });
    expect(f!.evidence['unmeasuredGal']).toBe(900);
  });

  it('does not count runs the controller skipped for rain', () => {
    expect(
      detectZeroWhileRunning(
        nights(6, () => 0, 'skipped-rain'),
        testContext(),
      ),
    ).toEqual([]);
  });

  it('lets one zero day pass and a meter that reads a little low', () => {
    expect(
      detectZeroWhileRunning(
        nights(6, (d) => (d === 3 ? 0 : 300)),
        testContext(),
      ),
    ).toEqual([]);
    expect(
      detectZeroWhileRunning(
        nights(6, () => 200),
        testContext(),
      ),
    ).toEqual([]);
  });
});
