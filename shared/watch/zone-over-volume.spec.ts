import { describe, expect, it } from 'vitest';
import { buildTimeline } from './hour-timeline';
import { HOUR_MS } from './site-clock';
import { hours, repeat, run, T0, testContext, testZones } from './watch-test-input';
import { detectOverVolume } from './zone-over-volume';

const DAY = 24 * HOUR_MS;

describe('detectOverVolume with a controller flow sensor', () => {
  it('flags a zone after two runs in a row at 1.5 × design or more', () => {
    // Zone A: 10 gpm × 30 min = 300 gal expected. Nights 0–2 normal, nights 3–4 draw 650 gal.
    const runs = [0, 1, 2, 3, 4].map((d) =>
      run('A', T0 + d * DAY + 22 * HOUR_MS, 30, { measuredGallons: d >= 3 ? 650 : 305 }),
    );
    const [f, ...rest] = detectOverVolume([], runs, testContext());
    expect(rest).toEqual([]);
    expect(f).toMatchObject({ subKind: 'over-volume', zoneId: 'A', periodStartUtc: runs[3]!.startUtc, ongoing: true });
    expect(f!.waterLostGal).toBe(2 * 350);
    expect(f!.evidence['medianRatio']).toBeCloseTo(650 / 300, 6);
  });

  it('lets one heavy run pass, and small excesses under the gallon floor', () => {
    const once = [0, 1, 2].map((d) => run('A', T0 + d * DAY, 30, { measuredGallons: d === 1 ? 650 : 300 }));
    expect(detectOverVolume([], once, testContext())).toEqual([]);
    // Zone C: 8 gpm × 2 min = 16 gal; 40 gal is 2.5 × but only 24 gal extra.
    const tiny = [0, 1].map((d) => run('C', T0 + d * DAY, 2, { measuredGallons: 40 }));
    expect(detectOverVolume([], tiny, testContext())).toEqual([]);
  });
});

describe('detectOverVolume from the site meter', () => {
  /**
   * Each night: A 22:00–22:40, B 22:40–23:20, C 23:20–00:00 (design 400, 400, 320 gal).
   * Hour 22 holds A 40 min + B 20 min; hour 23 holds B 20 min + C 40 min.
   */
  function nights(count: number, aFactor: (d: number) => number) {
    const values: number[] = [];
    const runs = [];
    for (let d = 0; d < count; d++) {
      const base = T0 + d * DAY;
      runs.push(
        run('A', base + 22 * HOUR_MS, 40),
        run('B', base + 22 * HOUR_MS + 40 * 60_000, 40),
        run('C', base + 23 * HOUR_MS + 20 * 60_000, 40),
      );
      values.push(...repeat(0, 22), 400 * aFactor(d) + 200, 200 + 320);
    }
    values.push(0);
    return { timeline: buildTimeline(hours(T0, values), runs, testZones, 'UTC'), runs };
  }

  it('pins extra water on the zone whose hours alone ran heavy, not on the neighbour sharing its hour', () => {
    const { timeline, runs } = nights(5, (d) => (d >= 2 ? 2.2 : 1));
    const findings = detectOverVolume(timeline, runs, testContext());
    expect(findings.map((f) => f.zoneId)).toEqual(['A']);
    // Hour 22 carries 480 gal extra on each heavy night, all of it A's: (400 + 480) / 400 = 2.2.
    expect(findings[0]!.evidence['medianRatio']).toBeCloseTo(2.2, 6);
    expect(findings[0]!.waterLostGal).toBeCloseTo(3 * 480, 6);
  });

  it('leaves runs unjudged when a lost reading hides part of the watering', () => {
    const { timeline, runs } = nights(5, (d) => (d >= 2 ? 2.2 : 1));
    const gappy = timeline.map((h) => (h.local.hour === 23 ? { ...h, gallons: null } : h));
    expect(detectOverVolume(gappy, runs, testContext())).toEqual([]);
  });

  it("takes a leak's steady flow off before judging zones", () => {
    const { timeline, runs } = nights(5, () => 1);
    const leaking = timeline.map((h) => ({ ...h, gallons: h.gallons! + 60 }));
    expect(detectOverVolume(leaking, runs, testContext())).toEqual([]);
  });
});

describe('detectOverVolume when zones share every metered hour', () => {
  it('raises one finding naming all the zones the meter cannot tell apart', () => {
    // A and B each water 20 min inside the 22:00 hour (200 + 200 gal design); the hour reads 700 every night.
    const values: number[] = [];
    const runs = [];
    for (let d = 0; d < 4; d++) {
      values.push(...repeat(0, 22), 700, 0);
      runs.push(run('A', T0 + d * DAY + 22 * HOUR_MS, 20), run('B', T0 + d * DAY + 22 * HOUR_MS + 20 * 60_000, 20));
    }
    const findings = detectOverVolume(buildTimeline(hours(T0, values), runs, testZones, 'UTC'), runs, testContext());
    expect(findings).toHaveLength(1);
    expect(findings[0]!.zoneId).toBeUndefined();
    expect(findings[0]!.suspectZoneIds).toEqual(['A', 'B']);
    expect(findings[0]!.key).toBe(`site-1|runaway-zone|over-volume|-|${new Date(T0 + 22 * HOUR_MS).toISOString()}`);
    // Each zone alone would explain the 300 extra gallons a night: 4 nights × 300, counted once.
    expect(findings[0]!.waterLostGal).toBe(1200);
  });
});
