/** Small hand-made inputs for the alerts unit tests (invented site, UTC clock unless a test says otherwise). */
import { resolveThresholds, type AlertThresholds } from './alert-thresholds';
import { HOUR_MS } from './site-clock';
import type { MeterHour, SiteFacts, WatchContext, ZoneFacts, ZoneRun } from './watch-inputs';

export const T0 = Date.UTC(2026, 5, 1); // 2026-06-01 00:00 UTC

export const testZones: ZoneFacts[] = [
  { zoneId: 'A', designGpm: 10 },
  { zoneId: 'B', designGpm: 10 },
  { zoneId: 'C', designGpm: 8 },
];

export function testSite(overrides: Partial<SiteFacts> = {}): SiteFacts {
  return {
    siteId: 'site-1',
    timeZone: 'UTC',
    irrigationWindow: { startHour: 21, endHour: 6 },
    monthlyBudgets: [{ month: '2026-06', gallons: 30_000 }],
    ...overrides,
  };
}

export function testContext(
  overrides: Partial<AlertThresholds> = {},
  site: Partial<SiteFacts> = {},
  zones: ZoneFacts[] = testZones,
): WatchContext {
  return { site: testSite(site), zones, thresholds: resolveThresholds(overrides), asOfUtc: T0 + 90 * 24 * HOUR_MS };
}

/** Consecutive hours from `fromUtc`, one per value; `null` leaves the hour out (a lost reading). */
export function hours(fromUtc: number, values: Array<number | null>): MeterHour[] {
  return values.flatMap((gallons, i) => (gallons === null ? [] : [{ startUtc: fromUtc + i * HOUR_MS, gallons }]));
}

/** `count` copies of a value. */
export const repeat = <T>(value: T, count: number): T[] => Array.from({ length: count }, () => value);

export function run(zoneId: string, startUtc: number, minutes: number, extra: Partial<ZoneRun> = {}): ZoneRun {
  return { zoneId, startUtc, minutes, cause: 'scheduled', ...extra };
}
