/**
 * Controllers keep their own clocks and drift by minutes; the meter's hours are the utility's. Before runs are
 * matched to metered hours, find the shift that best lines them up: the one that minimises the total absolute
 * difference between metered and expected gallons over the hours near runs. Ties go to the smaller shift.
 */
import { runSharesByHour } from './hour-timeline';
import { HOUR_MS } from './site-clock';
import { runWatered, type MeterHour, type ZoneFacts, type ZoneRun } from './watch-inputs';

/** Minutes to add to the controller's timestamps to put them on the meter's clock; 0 when nothing can be told. */
export function estimateControllerShiftMinutes(
  meterHours: readonly MeterHour[],
  runs: readonly ZoneRun[],
  zones: readonly ZoneFacts[],
  searchMinutes: number,
): number {
  const watered = runs.filter(runWatered);
  if (searchMinutes <= 0 || watered.length === 0 || meterHours.length === 0) return 0;
  const metered = new Map(meterHours.map((h) => [Math.floor(h.startUtc / HOUR_MS) * HOUR_MS, h.gallons]));
  // The same hours are scored for every shift, so the costs compare fairly.
  const scored = new Set<number>();
  for (const run of watered) {
    const from = Math.floor((run.startUtc - searchMinutes * 60_000) / HOUR_MS) * HOUR_MS;
    for (let h = from; h < run.startUtc + (run.minutes + searchMinutes) * 60_000; h += HOUR_MS)
      if (metered.has(h)) scored.add(h);
  }
  let best = 0;
  let bestCost = Number.POSITIVE_INFINITY;
  const shifts = [0, ...Array.from({ length: Math.floor(searchMinutes) }, (_, i) => [-(i + 1), i + 1]).flat()];
  for (const shift of shifts) {
    const shares = runSharesByHour(
      watered.map((r) => ({ ...r, startUtc: r.startUtc + shift * 60_000 })),
      zones,
    );
    let cost = 0;
    for (const h of scored)
      cost += Math.abs(metered.get(h)! - (shares.get(h) ?? []).reduce((s, x) => s + x.expectedGal, 0));
    if (cost < bestCost - 1e-9) {
      bestCost = cost;
      best = shift;
    }
  }
  return best;
}
