/**
 * Leaks: water that flows when nothing should be watering. Three views, for the data a site has:
 * continuous flow and raised minimum night flow on hourly meters (monthly reads: monthly-read-leak.ts).
 */
import { formatVolume } from '../units/format-quantity';
import { completeFinding, type ChartPoint, type Finding } from './finding';
import { groupConsecutive, itemAtCount, type TimelineHour } from './hour-timeline';
import { median, robustUpperLimit } from './robust-statistics';
import { DAY_MS, HOUR_MS, nightOf } from './site-clock';
import type { WatchContext } from './watch-inputs';
import { WATER_LOST_METHOD, waterLostOver } from './water-lost';

const gal = (v: number) => formatVolume(v, 'gal');

function hourlyPoints(timeline: readonly TimelineHour[], fromUtc: number, toUtc: number): ChartPoint[] {
  return timeline
    .filter((h) => h.startUtc >= fromUtc && h.startUtc < toUtc && h.gallons !== null)
    .map((h) => ({ atUtc: h.startUtc, value: h.gallons! }));
}

function longestUnbroken(hours: readonly TimelineHour[]): number {
  return Math.max(...groupConsecutive(hours, (a, b) => b.startUtc - a.startUtc === HOUR_MS).map((g) => g.length));
}

function lowerQuartile(values: readonly number[]): number {
  if (values.length === 0) return 0;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor((sorted.length - 1) / 4)]!;
}

/**
 * Both views of one leak: continuous flow and raised night flow usually see the same water, so a night-flow episode
 * overlapping a continuous-flow one (within a day) is left out: one leak, one alert.
 */
export function detectLeaks(timeline: readonly TimelineHour[], ctx: WatchContext): Finding[] {
  const continuous = detectContinuousFlow(timeline, ctx);
  const near = (a: Finding, b: Finding) =>
    a.periodStartUtc < b.periodEndUtc + DAY_MS && b.periodStartUtc < a.periodEndUtc + DAY_MS;
  const night = detectNightFlow(timeline, ctx).filter((n) => !continuous.some((c) => near(c, n)));
  return [...continuous, ...night];
}

/** The usual lowest night hour before `beforeUtc` (median of the latest baseline nights); 0 with no history. */
function usualNightLow(lows: readonly NightLow[], beforeUtc: number, ctx: WatchContext): number {
  const earlier = lows.filter((l) => l.lastUtc < beforeUtc).slice(-ctx.thresholds.nightBaselineNights);
  return earlier.length > 0 ? median(earlier.map((l) => l.lowestGal)) : 0;
}

/** Flow in every hour for at least `continuousFlowHours` (interval-meter rule of thumb; common practice, no source). */
export function detectContinuousFlow(timeline: readonly TimelineHour[], ctx: WatchContext): Finding[] {
  const t = ctx.thresholds;
  const lastHour = timeline[timeline.length - 1]?.startUtc;
  const lows = nightLows(timeline, ctx);
  // "Flowing" is above the site's own quietest nights (lower quartile, so a long leak cannot raise it): a site
  // with a steady trickle still has leaks that end, when the flow is back to that baseline.
  const baseline = lows.length >= t.nightMinBaselineNights ? lowerQuartile(lows.map((l) => l.lowestGal)) : 0;
  const floor = t.continuousFlowMinGph + baseline;
  // A missing hour breaks the run: we cannot claim flow we did not see.
  const flowing = timeline.filter((h) => h.gallons !== null && h.gallons > floor);
  // One lost reading between flowing hours does not end the episode, but the flag needs enough unbroken hours.
  const missing = new Set(timeline.filter((h) => h.gallons === null).map((h) => h.startUtc));
  const episodes = groupConsecutive(
    flowing,
    (a, b) =>
      b.startUtc - a.startUtc === HOUR_MS ||
      (b.startUtc - a.startUtc === 2 * HOUR_MS && missing.has(a.startUtc + HOUR_MS)),
  ).filter((g) => longestUnbroken(g) >= t.continuousFlowHours);
  return episodes.map((episode) => {
    const start = episode[0]!.startUtc;
    const end = episode[episode.length - 1]!.startUtc + HOUR_MS;
    const floorGph = Math.min(...episode.map((h) => h.gallons!));
    const hours = Math.round((end - start) / HOUR_MS);
    const baseline = usualNightLow(lows, start, ctx);
    const lost = waterLostOver(timeline, start, end, baseline);
    return completeFinding(
      {
        kind: 'leak',
        subKind: 'continuous-flow',
        periodStartUtc: start,
        periodEndUtc: end,
        detectedAtUtc: start + Math.max(t.continuousFlowHours, 1) * HOUR_MS,
        ongoing: episode[episode.length - 1]!.startUtc === lastHour,
        evidence: {
          hoursFlowing: hours,
          lowestHourGal: floorGph,
          excessRateGph: lost.rateGph,
          usualNightLowGph: baseline,
          totalGal: episode.reduce((s, h) => s + h.gallons!, 0),
        },
        series: [
          {
            label: 'Meter, gallons per hour',
            unit: 'gal/h',
            points: hourlyPoints(timeline, start - 24 * HOUR_MS, end),
          },
        ],
        waterLostGal: lost.gallons,
        explanation:
          `The meter never stopped for ${hours} hours in a row, about ${gal(lost.rateGph)} an hour above ` +
          `the usual ${gal(baseline)} when no zone ran: about ${gal(lost.gallons)} went to a leak. ` +
          WATER_LOST_METHOD,
        pricingMonth: episode[0]!.local.month,
      },
      ctx.site,
      t,
    );
  });
}

interface NightLow {
  night: string;
  firstUtc: number;
  lastUtc: number;
  lowestGal: number;
  quietHours: number;
}

/** Lowest metered hour of each night, counting only hours in which no zone watered. */
function nightLows(timeline: readonly TimelineHour[], ctx: WatchContext): NightLow[] {
  const window = { startHour: ctx.thresholds.nightStartHour, endHour: ctx.thresholds.nightEndHour };
  const nights = new Map<string, NightLow>();
  for (const h of timeline) {
    if (h.gallons === null || h.shares.length > 0) continue;
    const night = nightOf(h.local, window);
    if (!night) continue;
    const low = nights.get(night);
    if (!low)
      nights.set(night, { night, firstUtc: h.startUtc, lastUtc: h.startUtc, lowestGal: h.gallons, quietHours: 1 });
    else {
      low.lowestGal = Math.min(low.lowestGal, h.gallons);
      low.lastUtc = h.startUtc;
      low.quietHours += 1;
    }
  }
  return [...nights.values()]
    .filter((n) => n.quietHours >= ctx.thresholds.nightMinQuietHours)
    .sort((a, b) => a.firstUtc - b.firstUtc);
}

/**
 * Lowest night flow (hours with no zone running) against the site's own earlier nights: median + k·scaled MAD.
 * Nights judged high stay out of the baseline, so a lasting leak does not become the new normal.
 */
export function detectNightFlow(timeline: readonly TimelineHour[], ctx: WatchContext): Finding[] {
  const t = ctx.thresholds;
  const lows = nightLows(timeline, ctx);
  const normal: number[] = [];
  const judged = lows.map((low) => {
    const history = normal.slice(-t.nightBaselineNights);
    const limit =
      history.length >= t.nightMinBaselineNights
        ? robustUpperLimit(history, t.nightFlowMadK, t.nightFlowMinExcessGph)
        : null;
    const high = limit !== null && low.lowestGal > limit.limit;
    if (!high) normal.push(low.lowestGal);
    return { low, limit, high };
  });
  const lastNight = judged[judged.length - 1]?.low.night;
  const episodes = groupConsecutive(judged, (a, b) => a.high && b.high).filter(
    (g) => g[0]!.high && g.length >= t.nightFlowMinNights,
  );
  return episodes.map((episode) => {
    const first = episode[0]!;
    const last = episode[episode.length - 1]!;
    const baseline = first.limit!;
    // The episode runs from its first high night to the last: a leak does not stop at dawn, and it ends when a
    // night's low is back to the usual.
    const lost = waterLostOver(timeline, first.low.firstUtc, last.low.lastUtc + HOUR_MS, baseline.median);
    const recent = last.low.lowestGal;
    const chartFrom = first.low.firstUtc - 14 * 86_400_000;
    return completeFinding(
      {
        kind: 'leak',
        subKind: 'night-flow',
        periodStartUtc: first.low.firstUtc,
        periodEndUtc: last.low.lastUtc + HOUR_MS,
        detectedAtUtc: itemAtCount(episode, t.nightFlowMinNights).low.lastUtc + HOUR_MS,
        ongoing: last.low.night === lastNight,
        evidence: {
          nights: episode.length,
          recentNightLowGph: recent,
          baselineMedianGph: baseline.median,
          baselineScaledMadGph: baseline.scaledMad,
          limitGph: baseline.limit,
        },
        series: [
          {
            label: 'Lowest night hour with no zone running, gallons',
            unit: 'gal/h',
            points: lows
              .filter((l) => l.firstUtc >= chartFrom && l.firstUtc <= last.low.lastUtc)
              .map((l) => ({ atUtc: l.firstUtc, value: l.lowestGal })),
          },
        ],
        waterLostGal: lost.gallons,
        explanation:
          `For ${episode.length} nights the quietest hour still used ${gal(recent)}, ` +
          `against a usual ${gal(baseline.median)}; something is running ` +
          `that no zone explains, about ${gal(lost.gallons)} so far. ${WATER_LOST_METHOD}`,
        pricingMonth:
          timeline.find((h) => h.startUtc === first.low.firstUtc)?.local.month ?? first.low.night.slice(0, 7),
      },
      ctx.site,
      t,
    );
  });
}
