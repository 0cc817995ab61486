/**
 * Water lost over an episode, hour by hour: the metered water above what should have flowed. In hours with no zone
 * running that is the meter's reading above the site's usual flow; in hours where zones ran (their design flows
 * are often 15–20 % off, which would swamp the excess) and hours the meter missed, it is the episode's typical
 * excess rate for the minutes of the hour inside the episode. So a valve stuck open at 22:23 counts 37 minutes of
 * its first hour, and the next night's program does not blur the figure.
 */
import type { TimelineHour } from './hour-timeline';
import { median } from './robust-statistics';
import { HOUR_MS } from './site-clock';

/** The method in words, for the alert's evidence and text. */
export const WATER_LOST_METHOD =
  'Water lost adds up every hour of the episode: the metered water above the usual flow in hours with no zone ' +
  'running, and the typical excess rate for the minutes inside the episode in hours when zones ran or the meter ' +
  'sent nothing.';

export interface WaterLost {
  gallons: number;
  /** Median excess of the run-free metered hours, gal/h. */
  rateGph: number;
  /** Length of the episode, hours (partial hours as fractions). */
  hours: number;
}

/** Integrates the excess over `baselineGph` from `startUtc` to `endUtc` (epoch ms; need not be on the hour). */
export function waterLostOver(
  timeline: readonly TimelineHour[],
  startUtc: number,
  endUtc: number,
  baselineGph: number,
): WaterLost {
  const inside = timeline.filter((h) => h.startUtc < endUtc && h.startUtc + HOUR_MS > startUtc);
  const measurable = (h: TimelineHour) => h.gallons !== null && h.shares.length === 0;
  const clean = inside.filter(measurable).map((h) => Math.max(0, h.gallons! - baselineGph));
  const rateGph = clean.length > 0 ? median(clean) : 0;
  let gallons = 0;
  for (const h of inside) {
    const minutes = (Math.min(endUtc, h.startUtc + HOUR_MS) - Math.max(startUtc, h.startUtc)) / 60_000;
    // A run-free metered hour is read as the meter split it, partial first and last hours included.
    gallons += measurable(h) ? Math.max(0, h.gallons! - baselineGph) : (rateGph * minutes) / 60;
  }
  return { gallons, rateGph, hours: (endUtc - startUtc) / HOUR_MS };
}
