import { describe, expect, it } from 'vitest';
import { buildTimeline } from './hour-timeline';
import { detectLongRuns, detectOpenValve } from './runaway-zone-detection';
import { HOUR_MS } from './site-clock';
import { hours, repeat, run, T0, testContext, testZones } from './watch-test-input';

const DAY = 24 * HOUR_MS;

/** Nightly program A, B, C back to back from 22:00 with the given minutes. */
function program(d: number, a: number, b: number, c: number) {
  const s = T0 + d * DAY + 22 * HOUR_MS;
  return [run('A', s, a), run('B', s + a * 60_000, b), run('C', s + (a + b) * 60_000, c)];
}

describe('detectLongRuns', () => {
  it('flags a zone running far longer than its recent runs', () => {
    const runs = [
      ...Array.from({ length: 12 }, (_, d) => program(d, 10 + (d % 2), 15, 20)).flat(),
      ...program(12, 40, 15, 20),
    ];
    const [f, ...rest] = detectLongRuns(runs, testContext());
    expect(rest).toEqual([]);
    expect(f).toMatchObject({ subKind: 'long-run', zoneId: 'A', ongoing: true });
    expect(f!.evidence['longestMinutes']).toBe(40);
    // Usual run is the median of 10, 11, 10, 11, … = 10.5; 29.5 extra minutes × 10 gpm.
    expect(f!.evidence['usualMinutes']).toBe(10.5);
    expect(f!.waterLostGal).toBeCloseTo(295, 6);
  });

  it('names the zone as people know it (station and name) when the label is known', () => {
    const runs = [
      ...Array.from({ length: 12 }, (_, d) => program(d, 10 + (d % 2), 15, 20)).flat(),
      ...program(12, 40, 15, 20),
    ];
    const zones = testZones.map((z) => (z.zoneId === 'A' ? { ...z, label: 'Station 1 “Front lawn”' } : z));
    const [f] = detectLongRuns(runs, testContext({}, {}, zones));
    expect(f!.explanation).toMatch(/^Station 1 “Front lawn” ran up to 40 minutes/);
    expect(f!.series[0]!.label).toBe('Station 1 “Front lawn” run length, minutes');
  });

  it('does not flag the whole program growing together (a hot week or a raised seasonal %)', () => {
    const runs = [...Array.from({ length: 12 }, (_, d) => program(d, 10, 15, 20)).flat(), ...program(12, 17, 26, 34)];
    expect(detectLongRuns(runs, testContext())).toEqual([]);
  });

  it('ignores manual and skipped runs, and waits for enough history', () => {
    const runs = [
      ...Array.from({ length: 12 }, (_, d) => program(d, 10, 15, 20)).flat(),
      run('A', T0 + 12 * DAY + 14 * HOUR_MS, 60, { cause: 'manual' }),
      run('A', T0 + 13 * DAY + 22 * HOUR_MS, 60, { cause: 'skipped-rain' }),
    ];
    expect(detectLongRuns(runs, testContext())).toEqual([]);
    expect(detectLongRuns([...program(0, 10, 15, 20), ...program(1, 40, 15, 20)], testContext())).toEqual([]);
  });

  it('compares with the programmed minutes when they are known', () => {
    const zones = [{ zoneId: 'A', designGpm: 10, scheduledMinutes: 10 }];
    const findings = detectLongRuns([run('A', T0, 16)], testContext({}, {}, zones));
    expect(findings).toHaveLength(1);
    expect(findings[0]!.evidence['usualMinutes']).toBe(10);
  });
});

describe('detectOpenValve', () => {
  it("flags flow in the watering window with no zone running, at half the smallest zone's flow or more", () => {
    // Smallest zone 8 gpm → limit 4 gpm = 240 gal/h. Hours 02–05 read 480 gal/h with nothing running.
    const values = [...repeat(0, 2), ...repeat(480, 3), ...repeat(0, 19)];
    const [f, ...rest] = detectOpenValve(buildTimeline(hours(T0, values), [], testZones, 'UTC'), testContext());
    expect(rest).toEqual([]);
    expect(f).toMatchObject({
      subKind: 'open-valve',
      periodStartUtc: T0 + 2 * HOUR_MS,
      periodEndUtc: T0 + 5 * HOUR_MS,
    });
    expect(f!.evidence['limitGph']).toBe(240);
    expect(f!.explanation).toMatch(/close to Zone C's flow/); // 480 gal/h = 8 gpm
  });

  it('does not flag the same flow outside the window, below the limit, or while a zone runs', () => {
    const ctx = testContext();
    const daytime = [...repeat(0, 10), ...repeat(480, 3), ...repeat(0, 11)];
    expect(detectOpenValve(buildTimeline(hours(T0, daytime), [], testZones, 'UTC'), ctx)).toEqual([]);
    const leakSized = [...repeat(0, 2), ...repeat(120, 3), ...repeat(0, 19)];
    expect(detectOpenValve(buildTimeline(hours(T0, leakSized), [], testZones, 'UTC'), ctx)).toEqual([]);
    const watering = [...repeat(0, 2), ...repeat(600, 3), ...repeat(0, 19)];
    expect(
      detectOpenValve(buildTimeline(hours(T0, watering), [run('A', T0 + 2 * HOUR_MS, 180)], testZones, 'UTC'), ctx),
    ).toEqual([]);
  });

  it('keeps nights a day apart in one episode, as a stuck valve flows night after night', () => {
    const night = [...repeat(0, 2), ...repeat(480, 3), ...repeat(0, 19)];
    const findings = detectOpenValve(
      buildTimeline(hours(T0, [...night, ...night]), [], testZones, 'UTC'),
      testContext(),
    );
    expect(findings).toHaveLength(1);
    expect(findings[0]!.evidence['openHours']).toBe(6);
  });
});
