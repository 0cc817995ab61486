/**
 * Lines up meter hours, local clock facts and the zones running in each hour, so every detector walks the same
 * hour-by-hour picture. Missing meter hours stay in the timeline with `gallons: null`: silence is information.
 */
import { HOUR_MS, localHourOf, type LocalHour } from './site-clock';
import { runWatered, type MeterHour, type ZoneFacts, type ZoneRun } from './watch-inputs';

export interface RunShare {
  /** Index of the run in the input's `runs` array. */
  runIndex: number;
  zoneId: string;
  /** Minutes of the run inside this hour. */
  minutes: number;
  /** designGpm × minutes: what the zone should have drawn in this hour. */
  expectedGal: number;
}

export interface TimelineHour {
  startUtc: number;
  gallons: number | null;
  local: LocalHour;
  shares: RunShare[];
  expectedGal: number;
}

/** Shares of each run that watered, by UTC hour start. A run may span several hours. */
export function runSharesByHour(runs: readonly ZoneRun[], zones: readonly ZoneFacts[]): Map<number, RunShare[]> {
  const gpm = new Map(zones.map((z) => [z.zoneId, z.designGpm]));
  const byHour = new Map<number, RunShare[]>();
  runs.forEach((run, runIndex) => {
    if (!runWatered(run)) return;
    const end = run.startUtc + run.minutes * 60_000;
    for (let hour = Math.floor(run.startUtc / HOUR_MS) * HOUR_MS; hour < end; hour += HOUR_MS) {
      const minutes = (Math.min(end, hour + HOUR_MS) - Math.max(run.startUtc, hour)) / 60_000;
      if (minutes <= 0) continue;
      // A zone with no design flow on record still counts as running; it just has no expected volume.
      const share = { runIndex, zoneId: run.zoneId, minutes, expectedGal: (gpm.get(run.zoneId) ?? 0) * minutes };
      const list = byHour.get(hour);
      if (list) list.push(share);
      else byHour.set(hour, [share]);
    }
  });
  return byHour;
}

/** Every hour from the first meter hour to the last, in order; hours the meter never sent have `gallons: null`. */
export function buildTimeline(
  meterHours: readonly MeterHour[],
  runs: readonly ZoneRun[],
  zones: readonly ZoneFacts[],
  zone: string,
): TimelineHour[] {
  if (meterHours.length === 0) return [];
  const gallonsAt = new Map<number, number>();
  for (const h of meterHours) {
    const start = Math.floor(h.startUtc / HOUR_MS) * HOUR_MS;
    gallonsAt.set(start, (gallonsAt.get(start) ?? 0) + h.gallons);
  }
  const starts = [...gallonsAt.keys()].sort((a, b) => a - b);
  const shares = runSharesByHour(runs, zones);
  const timeline: TimelineHour[] = [];
  for (let t = starts[0]!; t <= starts[starts.length - 1]!; t += HOUR_MS) {
    const hourShares = shares.get(t) ?? [];
    timeline.push({
      startUtc: t,
      gallons: gallonsAt.get(t) ?? null,
      local: localHourOf(t, zone),
      shares: hourShares,
      expectedGal: hourShares.reduce((sum, s) => sum + s.expectedGal, 0),
    });
  }
  return timeline;
}

/** Splits a sorted list into runs of neighbours, where `joined(a, b)` says whether b continues a's run. */
export function groupConsecutive<T>(items: readonly T[], joined: (previous: T, next: T) => boolean): T[][] {
  const groups: T[][] = [];
  for (const item of items) {
    const current = groups[groups.length - 1];
    if (current && joined(current[current.length - 1]!, item)) current.push(item);
    else groups.push([item]);
  }
  return groups;
}

/** The item at which a run of `count` was reached (1-based, clamped to the list), e.g. the night a flag became due. */
export function itemAtCount<T>(items: readonly T[], count: number): T {
  if (items.length === 0) throw new RangeError('No items');
  return items[Math.min(items.length, Math.max(1, Math.ceil(count))) - 1]!;
}
