import { describe, expect, it } from 'vitest';
import { HOUR_MS } from './site-clock';
import { watchSite } from './site-watch';
import type { SiteWatchInput } from './watch-inputs';
import { hours, repeat, T0, testSite, testZones } from './watch-test-input';

// Ten quiet days, then a 30 gal/h leak that never stops for three days, on an otherwise idle meter.
// Both leak views see it (continuous flow, and a night low far above the ten quiet nights before): one alert.
const input: SiteWatchInput = {
  site: testSite({ thresholds: { overspendMinDays: 28 } }),
  zones: testZones,
  meterHours: hours(T0, [...repeat(0, 240), ...repeat(30, 72)]),
  runs: [],
  asOfUtc: T0 + 312 * HOUR_MS,
};

describe('watchSite', () => {
  it('runs the detectors the data allows and returns their findings in time order', () => {
    const findings = watchSite(input);
    expect(findings.map((f) => `${f.kind}/${f.subKind}`)).toEqual(['leak/continuous-flow']);
    expect(findings[0]!.periodStartUtc).toBe(T0 + 240 * HOUR_MS);
  });

  it('gives the same keys when run again with more data, so the job files no duplicate', () => {
    const later = watchSite({
      ...input,
      meterHours: hours(T0, [...repeat(0, 240), ...repeat(30, 96)]),
      asOfUtc: T0 + 336 * HOUR_MS,
    });
    expect(later.map((f) => f.key)).toEqual(watchSite(input).map((f) => f.key));
    expect(later[0]!.periodEndUtc).toBeGreaterThan(watchSite(input)[0]!.periodEndUtc);
  });

  it("applies the site's own thresholds", () => {
    const strict = watchSite({
      ...input,
      site: { ...input.site, thresholds: { continuousFlowHours: 96, nightFlowMinNights: 4 } },
    });
    expect(strict).toEqual([]);
  });

  it('uses monthly reads when the site has no interval data', () => {
    const monthly = watchSite({ ...input, meterHours: undefined, monthlyUse: [{ month: '2026-06', gallons: 60_000 }] });
    expect(monthly.map((f) => f.subKind)).toEqual(['month-far-over-budget']);
  });
});
