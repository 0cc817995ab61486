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

function daysOfMonths(first: string, count: number): number {
  const [y, m] = first.split('-').map(Number) as [number, number];
  return Math.round((Date.UTC(y, m - 1 + count, 1) - Date.UTC(y, m - 1, 1)) / 86_400_000);
}

function variations(
  name: string,
  make: (i: number) => { event: InjectedEvent | null; days?: number; startDate?: string; monthlyReadsOnly?: boolean },
): Scenario[] {
  return Array.from({ length: VARIATIONS }, (_, i) => {
    const made = make(i);
    const profile = SITE_PROFILES[i % SITE_PROFILES.length]!;
    return {
      id: `${name}-${String(i + 1).padStart(2, '0')}`,
      profile,
      seed: seedFrom(`${name}/${i}`),
      startDate: made.startDate ?? START_DATES[i % START_DATES.length]!,
      days: made.days ?? 75,
      event: made.event,
      ...(made.monthlyReadsOnly ? { monthlyReadsOnly: true } : {}),
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
            ? { kind: 'overspend-month', monthIndex: 2, how: 'seasonal-adjust', factor: step(i, 1.45, 1.8) }
            : { kind: 'overspend-month', monthIndex: 2, how: 'extra-start', factor: 2 },
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
