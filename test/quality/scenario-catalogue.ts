/**
 * The scenarios the quality test scores: for each injected event, twelve variations over the five invented
 * sites, with their own seeds, magnitudes and start dates (several cross a DST change), plus quiet scenarios
 * that must raise nothing. Magnitudes step evenly across each range so small and large cases are both present.
 */
import { seedFrom } from './seeded-random';
import { SITE_PROFILES } from './synthetic-site-profiles';
import type { InjectedEvent, Scenario } from './synthetic-sites';

export const VARIATIONS = 12;

// Start dates chosen so event days land near DST changes: LA/Denver/NY 2026-03-08 and 11-01, Sydney 04-05 and 10-04.
const START_DATES = ['2026-01-21', '2026-09-18', '2026-02-20', '2026-08-19', '2026-04-10', '2026-06-05'];
const MONTH_STARTS = [
  '2026-03-01',
  '2026-04-01',
  '2026-05-01',
  '2026-06-01',
  '2026-07-01',
  '2026-08-01',
  '2026-09-01',
  '2026-10-01',
];

const step = (i: number, min: number, max: number) => min + ((max - min) * i) / (VARIATIONS - 1);

/** Indexes of the two zones with the longest runs on the profile `variations` gives variation i. */
function longestTwo(i: number): [number, number] {
  const zones = SITE_PROFILES[i % SITE_PROFILES.length]!.zones;
  const order = zones.map((z, k) => ({ k, m: z.minutesAtReferenceEto })).sort((a, b) => b.m - a.m || a.k - b.k);
  return [order[0]!.k, order[1]!.k];
}

/** The last date of the month `offset` months after `first`. */
function lastDayOfMonth(first: string, offset: number): string {
  const [y, m] = first.split('-').map(Number) as [number, number];
  return new Date(Date.UTC(y, m - 1 + offset + 1, 0)).toISOString().slice(0, 10);
}

function daysOfMonths(first: string, count: number): number {
  const [y, m] = first.split('-').map(Number) as [number, number];
  return Math.round((Date.UTC(y, m - 1 + count, 1) - Date.UTC(y, m - 1, 1)) / 86_400_000);
}

function variations(
  name: string,
  make: (i: number) => Partial<Omit<Scenario, 'id' | 'profile' | 'seed' | 'event'>> & { event: InjectedEvent | null },
): Scenario[] {
  return Array.from({ length: VARIATIONS }, (_, i) => {
    const made = make(i);
    const profile = SITE_PROFILES[i % SITE_PROFILES.length]!;
    return {
      ...made,
      id: `${name}-${String(i + 1).padStart(2, '0')}`,
      profile,
      seed: seedFrom(`${name}/${i}`),
      startDate: made.startDate ?? START_DATES[i % START_DATES.length]!,
      days: made.days ?? 75,
    };
  });
}

export function buildScenarios(): Scenario[] {
  const startDay = (i: number) => 40 + ((i * 7) % 11);
  const zoneOf = (i: number) => (i * 5) % 4;
  return [
    ...variations('small-leak', (i) => ({
      event: { kind: 'small-leak', startDay: startDay(i), days: 6 + (i % 4) * 4, gpm: step(i, 0.2, 0.5) },
    })),
    ...variations('large-leak', (i) => ({
      event: { kind: 'large-leak', startDay: startDay(i), days: 2 + (i % 4), gpm: step(i, 1.0, 2.0) },
    })),
    ...variations('monthly-leak', (i) => {
      const first = MONTH_STARTS[i % MONTH_STARTS.length]!;
      // Leak starts in the third month and runs two to four weeks.
      return {
        startDate: first,
        days: daysOfMonths(first, 4),
        monthlyReadsOnly: true,
        event: {
          kind: 'large-leak',
          startDay: daysOfMonths(first, 2) + (i % 5),
          days: 14 + (i % 3) * 7,
          gpm: step(i, 1.0, 2.5),
        },
      };
    }),
    ...variations('stuck-valve', (i) => ({
      event: {
        kind: 'stuck-valve',
        startDay: startDay(i),
        days: 1 + (i % 4),
        zoneIndex: zoneOf(i),
        shareOfDesign: step(i, 0.8, 1.0),
      },
    })),
    ...variations('long-run', (i) => ({
      event: {
        kind: 'long-run',
        startDay: startDay(i),
        nights: 2 + (i % 4),
        zoneIndex: zoneOf(i),
        factor: step(i, 2.5, 5),
      },
    })),
    ...variations('broken-lateral', (i) => ({
      event: {
        kind: 'broken-lateral',
        startDay: startDay(i),
        nights: 5 + (i % 4),
        zoneIndex: zoneOf(i),
        factor: step(i, 1.8, 3.0),
      },
    })),
    ...variations('broken-meter', (i) => ({
      event: { kind: 'broken-meter', startDay: startDay(i), days: 4 + (i % 5) },
    })),
    // Every third silent meter stays silent to the end of the data: an ongoing silence.
    ...variations('silent-meter', (i) => ({
      event: { kind: 'silent-meter', startDay: startDay(i), days: i % 3 === 2 ? 99 : 3 + (i % 5) },
    })),
    ...variations('overspend', (i) => {
      const first = MONTH_STARTS[i % MONTH_STARTS.length]!;
      return {
        startDate: first,
        days: daysOfMonths(first, 3),
        event:
          i % 2 === 0
            ? { kind: 'overspend-month', monthIndexes: [2], how: 'seasonal-adjust', factor: step(i, 1.45, 1.8) }
            : { kind: 'overspend-month', monthIndexes: [2], how: 'extra-start', factor: 2 },
      };
    }),
    // The over month's last day has no weather and no normals: its budget covers the other days and still judges.
    ...variations('overspend-missing-weather', (i) => {
      const first = MONTH_STARTS[i % MONTH_STARTS.length]!;
      return {
        startDate: first,
        days: daysOfMonths(first, 3),
        missingWeatherDates: [lastDayOfMonth(first, 1), lastDayOfMonth(first, 2)],
        event: { kind: 'overspend-month', monthIndexes: [1], how: 'seasonal-adjust', factor: step(i, 1.45, 1.8) },
      };
    }),
    // Two months over, back to back: one alert each, never one running into the next.
    ...variations('overspend-back-to-back', (i) => {
      const first = MONTH_STARTS[i % MONTH_STARTS.length]!;
      return {
        startDate: first,
        days: daysOfMonths(first, 4),
        event: { kind: 'overspend-month', monthIndexes: [1, 2], how: 'seasonal-adjust', factor: step(i, 1.45, 1.8) },
      };
    }),
    // A leak that starts inside the watering window, mid-program, and flows day and night at a rate close to half a
    // small zone's design flow: one leak, never a valve.
    ...variations('leak-across-window', (i) => ({
      event: {
        kind: 'large-leak',
        startDay: startDay(i),
        days: 2 + (i % 4),
        gpm: step(i, 2.6, 3.4),
        startAt: { hour: SITE_PROFILES[i % SITE_PROFILES.length]!.cycleStartHour, minute: 35 },
      },
    })),
    // A valve stuck open at its design flow for more than a day, through the next nights' programs.
    ...variations('valve-over-a-day', (i) => ({
      event: {
        kind: 'stuck-valve',
        startDay: startDay(i),
        days: step(i, 1.5, 3),
        zoneIndex: zoneOf(i),
        shareOfDesign: 1,
      },
    })),
    // Cycle and soak: two zones alternate short cycles in the same meter hours; one of them runs away.
    // (The pair is the site's two longest-running zones, as cycle and soak is used on long runs.)
    ...variations('cycle-soak-runaway', (i) => {
      const pair = longestTwo(i);
      const zoneIndex = pair[Math.floor(i / 2) % 2]!;
      return {
        cycleSoak: pair,
        event:
          i % 2 === 0
            ? { kind: 'broken-lateral', startDay: startDay(i), nights: 5 + (i % 4), zoneIndex, factor: step(i, 1.8, 3) }
            : { kind: 'long-run', startDay: startDay(i), nights: 2 + (i % 4), zoneIndex, factor: step(i, 2.5, 5) },
      };
    }),
    ...variations('rainy-week', (i) => ({ event: { kind: 'rainy-week', startDay: startDay(i), days: 7 } })),
    ...variations('quiet', () => ({ event: null, days: 120 })),
    ...variations('quiet-monthly', (i) => {
      const first = MONTH_STARTS[i % MONTH_STARTS.length]!;
      return { startDate: first, days: daysOfMonths(first, 4), monthlyReadsOnly: true, event: null };
    }),
  ];
}
