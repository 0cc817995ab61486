import { describe, expect, it } from 'vitest';
import { buildTimeline } from './hour-timeline';
import { detectContinuousFlow, detectNightFlow } from './leak-detection';
import { detectMonthOverBudget } from './monthly-read-leak';
import { HOUR_MS, localMidnightUtc } from './site-clock';
import { hours, repeat, run, T0, testContext, testZones } from './watch-test-input';

const DAY = 24 * HOUR_MS;

describe('detectContinuousFlow', () => {
  it('flags 30 hours of unbroken flow and counts every hour above the usual flow as lost', () => {
    // 6 quiet hours, then 30 hours at 12 gal/h with one 400-gal irrigation hour inside, then quiet.
    const values = [...repeat(0, 6), ...repeat(12, 10), 400, ...repeat(12, 19), ...repeat(0, 6)];
    const ctx = testContext();
    const [f, ...rest] = detectContinuousFlow(buildTimeline(hours(T0, values), [], testZones, 'UTC'), ctx);
    expect(rest).toEqual([]);
    expect(f).toMatchObject({
      kind: 'leak',
      subKind: 'continuous-flow',
      periodStartUtc: T0 + 6 * HOUR_MS,
      periodEndUtc: T0 + 36 * HOUR_MS,
      ongoing: false,
    });
    expect(f!.evidence['lowestHourGal']).toBe(12);
    // No run explains the 400-gal hour: it is lost water too.
    expect(f!.waterLostGal).toBe(12 * 29 + 400);
    expect(f!.detectedAtUtc).toBe(T0 + 30 * HOUR_MS);
  });

  it('does not flag 23 hours, nor flow broken by a lost reading', () => {
    const ctx = testContext();
    expect(detectContinuousFlow(buildTimeline(hours(T0, [0, ...repeat(5, 23), 0]), [], testZones, 'UTC'), ctx)).toEqual(
      [],
    );
    const broken = [0, ...repeat(5, 15), null, ...repeat(5, 15), 0];
    expect(detectContinuousFlow(buildTimeline(hours(T0, broken), [], testZones, 'UTC'), ctx)).toEqual([]);
  });

  it("follows the site's own hour count", () => {
    const ctx = testContext({ continuousFlowHours: 12 });
    expect(
      detectContinuousFlow(buildTimeline(hours(T0, [0, ...repeat(5, 13), 0]), [], testZones, 'UTC'), ctx),
    ).toHaveLength(1);
  });
});

describe('detectNightFlow', () => {
  /** `nights` days; night hours 01–04 read `low(d)`; zone A waters 22:00–23:00 with 600 gal. */
  function days(count: number, low: (d: number) => number) {
    const values: number[] = [];
    const runs = [];
    for (let d = 0; d < count; d++) {
      for (let h = 0; h < 24; h++) values.push(h === 22 ? 600 : h >= 1 && h < 5 ? low(d) : 0);
      runs.push(run('A', T0 + d * DAY + 22 * HOUR_MS, 60));
    }
    return { meter: hours(T0, values), runs };
  }

  it("flags nights whose quiet-hour low rises above the site's own baseline", () => {
    // 20 nights at 0–2 gal/h (median 1, scaled MAD 1.48 → limit 1 + 4×1.48 = 6.9), then 3 nights at 18 gal/h.
    const { meter, runs } = days(23, (d) => (d < 20 ? d % 3 : 18));
    const [f, ...rest] = detectNightFlow(buildTimeline(meter, runs, testZones, 'UTC'), testContext());
    expect(rest).toEqual([]);
    expect(f).toMatchObject({ kind: 'leak', subKind: 'night-flow', ongoing: true });
    expect(f!.periodStartUtc).toBe(T0 + 20 * DAY + HOUR_MS);
    expect(f!.evidence['baselineMedianGph']).toBe(1);
    expect(f!.evidence['limitGph']).toBeCloseTo(1 + 4 * 1.4826, 3);
    // Water lost is what the meter saw above the usual low: (18 − 1) gal/h in the four night hours of three nights
    // (this meter shows nothing by day), not a night rate assumed to run all day.
    expect(f!.waterLostGal).toBeCloseTo(17 * 4 * 3, 6);
  });

  it('ignores night hours in which a zone was running', () => {
    const { meter, runs } = days(23, () => 0);
    // Zone B waters 02:00–03:00 on the last three nights at 600 gal: not a leak.
    const late = [20, 21, 22].map((d) => run('B', T0 + d * DAY + 2 * HOUR_MS, 60));
    const values = meter.map((h) => (late.some((r) => r.startUtc === h.startUtc) ? { ...h, gallons: 600 } : h));
    expect(detectNightFlow(buildTimeline(values, [...runs, ...late], testZones, 'UTC'), testContext())).toEqual([]);
  });

  it('needs two high nights in a row and enough baseline nights', () => {
    const oneNight = days(21, (d) => (d === 20 ? 18 : 0));
    expect(detectNightFlow(buildTimeline(oneNight.meter, oneNight.runs, testZones, 'UTC'), testContext())).toEqual([]);
    const young = days(8, (d) => (d < 5 ? 0 : 18));
    expect(detectNightFlow(buildTimeline(young.meter, young.runs, testZones, 'UTC'), testContext())).toEqual([]);
  });

  it('reads night as local hours across the fall-back change in Los Angeles', () => {
    const zone = 'America/Los_Angeles';
    const start = localMidnightUtc('2026-10-15', zone);
    const end = localMidnightUtc('2026-11-05', zone);
    const values: number[] = [];
    for (let t = start; t < end; t += HOUR_MS) {
      // 20 gal/h only in local 01:00–04:59 from 1 Nov, which starts at 08:00 UTC before the change and 09:00 after.
      const local = new Date(t + (t < Date.UTC(2026, 10, 1, 9) ? -7 : -8) * HOUR_MS);
      values.push(
        t >= localMidnightUtc('2026-11-01', zone) && local.getUTCHours() >= 1 && local.getUTCHours() < 5 ? 20 : 0,
      );
    }
    const ctx = testContext({}, { timeZone: zone });
    const [f] = detectNightFlow(buildTimeline(hours(start, values), [], testZones, zone), ctx);
    expect(f!.periodStartUtc).toBe(Date.UTC(2026, 10, 1, 8)); // 01:00 PDT, the first of the two local 01:00s
  });
});

describe('detectMonthOverBudget', () => {
  it('flags a monthly read at 1.5 × budget or more, and not 1.4 ×', () => {
    const ctx = testContext(
      {},
      {
        monthlyBudgets: [
          { month: '2026-06', gallons: 30_000 },
          { month: '2026-07', gallons: 40_000 },
        ],
      },
    );
    const findings = detectMonthOverBudget(
      [
        { month: '2026-06', gallons: 45_000 },
        { month: '2026-07', gallons: 56_000 },
      ],
      ctx,
    );
    expect(findings).toHaveLength(1);
    expect(findings[0]).toMatchObject({
      subKind: 'month-far-over-budget',
      periodStartUtc: Date.UTC(2026, 5, 1),
      periodEndUtc: Date.UTC(2026, 6, 1),
      waterLostGal: 15_000,
    });
  });
});
