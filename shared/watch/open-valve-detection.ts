/**
 * Runaway zone, valve stuck open: extra water that starts when a zone's run ends and keeps flowing at that zone's
 * design flow. Flow that starts at any other moment, or at a rate no zone's design explains, is not blamed on a
 * valve: if it goes on outside the watering window and the scheduled runs it is a leak (leak-detection.ts), one
 * alert. A valve stuck for days is one episode: the next nights' programs run on top of it without ending it.
 */
import { formatVolume } from '../units/format-quantity';
import { completeFinding, type Finding } from './finding';
import { groupConsecutive, itemAtCount, type TimelineHour } from './hour-timeline';
import { median } from './robust-statistics';
import { HOUR_MS, localDateTimeOf, localHourOf } from './site-clock';
import { runWatered, zoneName, type WatchContext, type ZoneFacts, type ZoneRun } from './watch-inputs';
import { WATER_LOST_METHOD, waterLostOver } from './water-lost';

const gal = (v: number) => formatVolume(v, 'gal');
/** Meters count whole gallons; per-hour comparisons allow this much. */
const ROUNDING_GAL = 2;

interface Indexed {
  h: TimelineHour;
  i: number;
}

interface Suspect {
  zone: ZoneFacts;
  run: ZoneRun;
  endUtc: number;
}

/** Flow above the expected runs and the usual low, per hour. */
const excessOf = (h: TimelineHour, baseGph: number) => (h.gallons ?? 0) - h.expectedGal - baseGph;

/**
 * The quietest usual flow: the lower quartile of run-free metered hours in the local night hours (a quartile, so a
 * valve open for many of the nights read cannot become the usual).
 */
function usualLow(timeline: readonly TimelineHour[], ctx: WatchContext): number {
  const t = ctx.thresholds;
  const quiet = timeline.filter(
    (h) =>
      h.gallons !== null && h.shares.length === 0 && h.local.hour >= t.nightStartHour && h.local.hour < t.nightEndHour,
  );
  const sorted = quiet.map((h) => h.gallons!).sort((a, b) => a - b);
  return sorted.length > 0 ? sorted[Math.floor((sorted.length - 1) / 4)]! : 0;
}

/**
 * Episodes of extra flow seen in run-free hours: hours above the limit, joined across hours when zones ran or the
 * meter missed (the extra hides under the runs there), split by any run-free hour back under it.
 */
function extraFlowEpisodes(timeline: readonly TimelineHour[], limitGph: number, baseGph: number): Indexed[][] {
  const judged = timeline.map((h, i) => ({ h, i })).filter(({ h }) => h.gallons !== null && h.shares.length === 0);
  const high = judged.map((x) => ({ ...x, high: excessOf(x.h, baseGph) >= limitGph }));
  return groupConsecutive(high, (a, b) => a.high && b.high).filter((g) => g[0]!.high);
}

/** Runs whose end falls in the hours from the last quiet hour before the episode up to its first high hour. */
function runsEndingBefore(timeline: readonly TimelineHour[], runs: readonly ZoneRun[], firstIndex: number): ZoneRun[] {
  let from = firstIndex - 1;
  while (from >= 0 && (timeline[from]!.shares.length > 0 || timeline[from]!.gallons === null)) from--;
  const fromUtc = timeline[Math.max(0, from)]!.startUtc;
  const toUtc = timeline[firstIndex]!.startUtc;
  return runs.filter((r) => {
    const end = r.startUtc + r.minutes * 60_000;
    return runWatered(r) && end > fromUtc && end <= toUtc;
  });
}

/**
 * The run whose end best explains the extra: its zone's design flow matches the rate within the tolerance, and in
 * the hours around its end the metered excess is no more than the rate gives for the minutes after that end (no
 * extra before it).
 */
function bestSuspect(
  timeline: readonly TimelineHour[],
  candidates: ZoneRun[],
  rateGph: number,
  baseGph: number,
  ctx: WatchContext,
): Suspect | null {
  const tolerance = ctx.thresholds.openValveDesignTolerance;
  let best: { s: Suspect; misfit: number } | null = null;
  for (const run of candidates) {
    const zone = ctx.zones.find((z) => z.zoneId === run.zoneId);
    if (!zone || !(zone.designGpm > 0) || Math.abs(rateGph / (zone.designGpm * 60) - 1) > tolerance) continue;
    const endUtc = run.startUtc + run.minutes * 60_000;
    const hours = timeline.filter((h) => h.startUtc + HOUR_MS > endUtc - 2 * HOUR_MS && h.startUtc < endUtc + HOUR_MS);
    let misfit = 0;
    let fits = true;
    for (const h of hours) {
      if (h.gallons === null) continue;
      const minutesAfter = Math.max(0, Math.min(60, (h.startUtc + HOUR_MS - endUtc) / 60_000));
      const predicted = (rateGph * minutesAfter) / 60;
      const over = excessOf(h, baseGph) - predicted;
      misfit += Math.abs(over);
      // Extra water before the run's end means the flow did not start there. Less than the design flows predict
      // says only that the records are high, which is common.
      if (over > tolerance * rateGph + ctx.thresholds.overVolumeHourTolerance * h.expectedGal + ROUNDING_GAL)
        fits = false;
    }
    if (fits && (!best || misfit < best.misfit)) best = { s: { zone, run, endUtc }, misfit };
  }
  return best?.s ?? null;
}

export function detectOpenValve(
  timeline: readonly TimelineHour[],
  runs: readonly ZoneRun[],
  ctx: WatchContext,
): Finding[] {
  const t = ctx.thresholds;
  const known = ctx.zones.filter((z) => z.designGpm > 0);
  if (known.length === 0) return [];
  const limitGph = t.openValveShareOfSmallestZone * Math.min(...known.map((z) => z.designGpm)) * 60;
  const baseGph = usualLow(timeline, ctx);
  const lastHour = timeline[timeline.length - 1]?.startUtc ?? 0;
  const findings: Finding[] = [];
  for (const episode of extraFlowEpisodes(timeline, limitGph, baseGph)) {
    if (episode.length < t.openValveMinHours) continue;
    const rateGph = median(episode.map(({ h }) => excessOf(h, baseGph)));
    const suspect = bestSuspect(timeline, runsEndingBefore(timeline, runs, episode[0]!.i), rateGph, baseGph, ctx);
    if (!suspect) continue;
    const end = episode[episode.length - 1]!.h.startUtc + HOUR_MS;
    const lost = waterLostOver(timeline, suspect.endUtc, end, baseGph);
    const name = zoneName(ctx.zones, suspect.zone.zoneId);
    const endsAt = localHourOf(suspect.endUtc, ctx.site.timeZone);
    findings.push(
      completeFinding(
        {
          kind: 'runaway-zone',
          subKind: 'open-valve',
          zoneId: suspect.zone.zoneId,
          periodStartUtc: suspect.endUtc,
          periodEndUtc: end,
          detectedAtUtc: itemAtCount(episode, t.openValveMinHours).h.startUtc + HOUR_MS,
          ongoing: episode[episode.length - 1]!.h.startUtc === lastHour,
          evidence: {
            openHours: lost.hours,
            excessRateGph: rateGph,
            designGph: suspect.zone.designGpm * 60,
            toleranceShare: t.openValveDesignTolerance,
            usualLowGph: baseGph,
          },
          series: [
            {
              label: 'Meter, gallons per hour',
              unit: 'gal/h',
              points: timeline
                .filter((h) => h.startUtc >= suspect.endUtc - 24 * HOUR_MS && h.startUtc < end && h.gallons !== null)
                .map((h) => ({ atUtc: h.startUtc, value: h.gallons! })),
            },
          ],
          waterLostGal: lost.gallons,
          explanation:
            `Extra water began when ${name}'s run ended ` +
            `(${localDateTimeOf(suspect.endUtc, ctx.site.timeZone)}) and kept ` +
            `flowing at about ${gal(rateGph)} an hour, within ${Math.round(t.openValveDesignTolerance * 100)} % of ` +
            `its design flow (${gal(suspect.zone.designGpm * 60)} an hour), for ${lost.hours.toFixed(1)} hours: ` +
            `its valve is probably stuck open, about ${gal(lost.gallons)} so far. ${WATER_LOST_METHOD} ` +
            'Shut the water off at the valve box or the point of connection before working on the valve.',
          pricingMonth: endsAt.month,
        },
        ctx.site,
        t,
      ),
    );
  }
  return findings;
}
