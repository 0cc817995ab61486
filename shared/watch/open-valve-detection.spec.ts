import { describe, expect, it } from 'vitest';
import { buildTimeline } from './hour-timeline';
import { detectOpenValve } from './open-valve-detection';
import { HOUR_MS } from './site-clock';
import { hours, repeat, run, T0, testContext, testZones } from './watch-test-input';

const labelled = testZones.map((z) => ({ ...z, label: `Station ${z.zoneId.charCodeAt(0) - 64} “Bed ${z.zoneId}”` }));

describe('detectOpenValve', () => {
  it('blames the station whose run ended as the extra flow began at its design flow, and counts every minute', () => {
    // Zone A (10 gpm) runs 22:00–22:30; its valve then stays open at 10 gpm for 30 hours.
    const runs = [run('A', T0 + 22 * HOUR_MS, 30)];
    const values = [...repeat(0, 22), 600, ...repeat(600, 29), 300, ...repeat(0, 10)];
    // The meter: 22:00 hour = 300 (run) + 300 (open after 22:30); then 600 an hour; the last hour half.
    values[22] = 600;
    const timeline = buildTimeline(hours(T0, values), runs, labelled, 'UTC');
    const [f, ...rest] = detectOpenValve(timeline, runs, testContext({}, {}, labelled));
    expect(rest).toEqual([]);
    expect(f).toMatchObject({ kind: 'runaway-zone', subKind: 'open-valve', zoneId: 'A' });
    expect(f!.periodStartUtc).toBe(T0 + 22.5 * HOUR_MS);
    // 30 minutes of the first hour, 29 full hours, half of the last: 300 + 29 × 600 + 300.
    expect(f!.waterLostGal).toBeCloseTo(300 + 29 * 600 + 300, 6);
    expect(f!.explanation).toContain('Station 1 “Bed A”');
    expect(f!.explanation).not.toMatch(/zone A\b/i);
  });

  it('does not blame a valve for flow that started with no run ending, nor for a rate no design flow explains', () => {
    // 600 gal/h from 13:00 with no run at all: a leak's job, not a valve's.
    const leak = buildTimeline(hours(T0, [...repeat(0, 13), ...repeat(600, 30)]), [], labelled, 'UTC');
    expect(detectOpenValve(leak, [], testContext({}, {}, labelled))).toEqual([]);
    // After zone A's run, 300 gal/h (5 gpm): half its 10 gpm design, outside the 25 % tolerance.
    const runs = [run('A', T0 + 22 * HOUR_MS, 60)];
    const half = buildTimeline(hours(T0, [...repeat(0, 22), 600, ...repeat(300, 20)]), runs, labelled, 'UTC');
    expect(detectOpenValve(half, runs, testContext({}, {}, labelled))).toEqual([]);
  });

  it("keeps the next night's program inside one episode: a stuck valve flows through it", () => {
    // A's valve sticks at 22:30 on day 1; on day 2 zone B (10 gpm) runs 22:00–23:00 on top of it.
    const runs = [run('A', T0 + 22 * HOUR_MS, 30), run('B', T0 + 46 * HOUR_MS, 60)];
    const values = [...repeat(0, 22), 600, ...repeat(600, 23), 1200, ...repeat(600, 10)];
    const timeline = buildTimeline(hours(T0, values), runs, labelled, 'UTC');
    const found = detectOpenValve(timeline, runs, testContext({}, {}, labelled));
    expect(found).toHaveLength(1);
    expect(found[0]!.ongoing).toBe(true);
    expect(found[0]!.waterLostGal).toBeCloseTo(300 + 34 * 600, 6);
  });
});
