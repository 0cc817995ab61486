import { describe, expect, it } from 'vitest';
import { repairVerifiable, verifyRepair, REPAIR_NIGHTS } from './repair-check';
import { HOUR_MS } from './site-clock';
import { hours, repeat, run, T0, testSite, testZones } from './watch-test-input';
import type { SiteWatchInput } from './watch-inputs';

const DAY = 24 * HOUR_MS;
const input = (over: Partial<SiteWatchInput>): SiteWatchInput => ({
  site: testSite(),
  zones: testZones,
  runs: [],
  asOfUtc: T0 + 30 * DAY,
  ...over,
});
const leak = { kind: 'leak', subKind: 'night-flow', zoneId: null, evidence: { baselineMedianGph: 2 } };

describe('verifyRepair', () => {
  it('confirms a leak repair when the nights after it are back to the usual night low', () => {
    // 10 days at 2 gal/h, then a repair at day 10 and nights at 2.5 gal/h (within the 3 gal/h margin).
    const meterHours = hours(T0, [...repeat(9, 10 * 24), ...repeat(2.5, 5 * 24)]);
    const v = verifyRepair({ ...leak, repairedAtUtc: T0 + 10 * DAY }, input({ meterHours }));
    expect(v).toMatchObject({ status: 'verified' });
    if (v?.status !== 'verified') throw new Error('expected a verdict');
    expect(v.numbers).toMatchObject({ nightsAfterRepair: REPAIR_NIGHTS, medianNightLowGph: 2.5, usualNightLowGph: 2 });
    expect(v.series[0]!.points.length).toBeGreaterThan(REPAIR_NIGHTS);
  });

  it('does not confirm it when night flow stays high, and waits while fewer nights have passed', () => {
    const meterHours = hours(T0, [...repeat(9, 10 * 24), ...repeat(9, 5 * 24)]);
    expect(verifyRepair({ ...leak, repairedAtUtc: T0 + 10 * DAY }, input({ meterHours }))).toMatchObject({
      status: 'not-verified',
    });
    const early = hours(T0, repeat(9, 11 * 24 + 12));
    expect(verifyRepair({ ...leak, repairedAtUtc: T0 + 10 * DAY }, input({ meterHours: early }))).toEqual({
      status: 'pending',
      seen: 2,
    });
  });

  it('judges a long-running zone by its next runs against its usual minutes', () => {
    const runs = [10, 11, 12].map((m, i) => run('A', T0 + (11 + i) * DAY + 22 * HOUR_MS, m));
    const repair = { kind: 'runaway-zone', subKind: 'long-run', zoneId: 'A', evidence: { usualMinutes: 10 } };
    expect(verifyRepair({ ...repair, repairedAtUtc: T0 + 10 * DAY }, input({ runs }))).toMatchObject({
      status: 'verified',
      numbers: { medianMinutes: 11 },
    });
    const stillLong = [40, 40, 12].map((m, i) => run('A', T0 + (11 + i) * DAY + 22 * HOUR_MS, m));
    expect(verifyRepair({ ...repair, repairedAtUtc: T0 + 10 * DAY }, input({ runs: stillLong }))).toMatchObject({
      status: 'not-verified',
    });
  });

  it('leaves budgets, rules and weather to people', () => {
    expect(repairVerifiable('calendar-month', null)).toBe(false);
    expect(repairVerifiable('outside-rules', null)).toBe(false);
    expect(repairVerifiable('over-volume', null)).toBe(false);
    expect(repairVerifiable('over-volume', 4)).toBe(true);
    expect(repairVerifiable('continuous-flow', null)).toBe(true);
  });
});
