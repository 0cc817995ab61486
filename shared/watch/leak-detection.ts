/**
 * Leaks: water that flows when nothing should be watering. Three views, for the data a site has:
 * continuous flow and raised minimum night flow on hourly meters, and a month far over budget on monthly reads.
 */
import { formatVolume } from '../units/format-quantity';
import { completeFinding, type ChartPoint, type Finding } from './finding';
import { groupConsecutive, itemAtCount, type TimelineHour } from './hour-timeline';
import { robustUpperLimit } from './robust-statistics';
import { HOUR_MS, localMidnightUtc, nightOf } from './site-clock';
import type { MonthlyUse, WatchContext } from './watch-inputs';

const gal = (v: number) => formatVolume(v, 'gal');

function hourlyPoints(timeline: readonly TimelineHour[], fromUtc: number, toUtc: number): ChartPoint[] {
  return timeline
    .filter((h) => h.startUtc >= fromUtc && h.startUtc < toUtc && h.gallons !== null)
    .map((h) => ({ atUtc: h.startUtc, value: h.gallons! }));
}

/** Flow in every hour for at least `continuousFlowHours` (interval-meter rule of thumb; common practice, no source). */
export function detectContinuousFlow(timeline: readonly TimelineHour[], ctx: WatchContext): Finding[] {
  const t = ctx.thresholds;
  const lastHour = timeline[timeline.length - 1]?.startUtc;
  // A missing hour breaks the run: we cannot claim flow we did not see.
  const flowing = timeline.filter((h) => h.gallons !== null && h.gallons > t.continuousFlowMinGph);
  const episodes = groupConsecutive(flowing, (a, b) => b.startUtc - a.startUtc === HOUR_MS).filter(
    (g) => g.length >= t.continuousFlowHours,
  );
  return episodes.map((episode) => {
    const start = episode[0]!.startUtc;
    const end = episode[episode.length - 1]!.startUtc + HOUR_MS;
    // The floor under every hour is what never stopped; irrigation on top of it is not waste.
    const floorGph = Math.min(...episode.map((h) => h.gallons!));
    const hours = episode.length;
    const lost = floorGph * hours;
    return completeFinding(
      {
        kind: 'leak',
        subKind: 'continuous-flow',
        periodStartUtc: start,
        periodEndUtc: end,
        detectedAtUtc: start + t.continuousFlowHours * HOUR_MS,
        ongoing: episode[episode.length - 1]!.startUtc === lastHour,
        evidence: {
          hoursFlowing: hours,
          lowestHourGal: floorGph,
          totalGal: episode.reduce((s, h) => s + h.gallons!, 0),
        },
        series: [
          {
            label: 'Meter, gallons per hour',
            unit: 'gal/h',
            points: hourlyPoints(timeline, start - 24 * HOUR_MS, end),
          },
        ],
        waterLostGal: lost,
        explanation:
          `The meter never stopped for ${hours} hours in a row and never ` +
          `read below ${gal(floorGph)} an hour, so about ${gal(lost)} went ` +
          'to a leak or a valve that does not close.',
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
    // Night excess over the usual low, assumed to run all day: a leak does not stop at dawn.
    const lost = episode.reduce((s, e) => s + Math.max(0, e.low.lowestGal - baseline.median) * 24, 0);
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
        waterLostGal: lost,
        explanation:
          `For ${episode.length} nights the quietest hour still used ${gal(recent)}, ` +
          `against a usual ${gal(baseline.median)}; something is running ` +
          `that no zone explains, about ${gal(lost)} so far.`,
        pricingMonth:
          timeline.find((h) => h.startUtc === first.low.firstUtc)?.local.month ?? first.low.night.slice(0, 7),
      },
      ctx.site,
      t,
    );
  });
}

/** Monthly-read sites: a month at `monthlyLeakRatio` × budget or more (common practice, no source). */
export function detectMonthOverBudget(monthlyUse: readonly MonthlyUse[], ctx: WatchContext): Finding[] {
  const t = ctx.thresholds;
  const budgets = new Map(ctx.site.monthlyBudgets.map((b) => [b.month, b.gallons]));
  const findings: Finding[] = [];
  for (const use of [...monthlyUse].sort((a, b) => a.month.localeCompare(b.month))) {
    const budget = budgets.get(use.month);
    if (!budget || budget <= 0) continue;
    const ratio = use.gallons / budget;
    if (ratio < t.monthlyLeakRatio) continue;
    const [y, m] = use.month.split('-').map(Number) as [number, number];
    const next = new Date(Date.UTC(y, m, 1)).toISOString().slice(0, 10);
    const start = localMidnightUtc(`${use.month}-01`, ctx.site.timeZone);
    const lost = use.gallons - budget;
    findings.push(
      completeFinding(
        {
          kind: 'leak',
          subKind: 'month-far-over-budget',
          periodStartUtc: start,
          periodEndUtc: localMidnightUtc(next, ctx.site.timeZone),
          detectedAtUtc: localMidnightUtc(next, ctx.site.timeZone),
          ongoing: false,
          evidence: { monthGal: use.gallons, budgetGal: budget, ratio },
          series: [
            {
              label: 'Monthly use, gallons',
              unit: 'gal',
              points: monthlyUse.map((u) => ({
                atUtc: localMidnightUtc(`${u.month}-01`, ctx.site.timeZone),
                value: u.gallons,
              })),
            },
            {
              label: 'Monthly budget, gallons',
              unit: 'gal',
              points: ctx.site.monthlyBudgets.map((b) => ({
                atUtc: localMidnightUtc(`${b.month}-01`, ctx.site.timeZone),
                value: b.gallons,
              })),
            },
          ],
          waterLostGal: lost,
          explanation:
            `${use.month} used ${gal(use.gallons)}, ${ratio.toFixed(1)} times ` +
            `its ${gal(budget)} budget; with only monthly reads this much ` +
            'extra usually means a leak.',
          pricingMonth: use.month,
        },
        ctx.site,
        t,
      ),
    );
  }
  return findings;
}
