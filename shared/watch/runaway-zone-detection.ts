/**
 * Runaway zone, from the controller's side: a zone running much longer than its history or its schedule, and
 * water flowing in the watering window while the controller says no zone runs (a valve stuck open).
 * Over-volume against design flow lives in zone-over-volume.ts.
 */
import { formatVolume } from '../units/format-quantity';
import { completeFinding, type Finding } from './finding';
import { groupConsecutive, itemAtCount, type TimelineHour } from './hour-timeline';
import { median, robustUpperLimit } from './robust-statistics';
import { HOUR_MS, inLocalWindow, localHourOf } from './site-clock';
import { runWatered, zoneName, type WatchContext, type ZoneRun } from './watch-inputs';

const gal = (v: number) => formatVolume(v, 'gal');

interface RunJudgement {
  run: ZoneRun;
  usualMinutes: number | null;
  long: boolean;
}

/** Runs that follow one another within this gap belong to the same watering program. */
const PROGRAM_GAP_MS = 30 * 60_000;

/**
 * How much the whole program was scaled that night (ET adjustment, a seasonal %): the median, over its zones, of
 * each run ÷ that zone's usual run. Needs three zones with history so one runaway zone cannot move the median.
 */
function programFactors(runs: readonly ZoneRun[], usual: (run: ZoneRun) => number | null): Map<ZoneRun, number> {
  const factors = new Map<ZoneRun, number>();
  const sorted = [...runs].sort((a, b) => a.startUtc - b.startUtc);
  const programs = groupConsecutive(sorted, (a, b) => b.startUtc <= a.startUtc + a.minutes * 60_000 + PROGRAM_GAP_MS);
  for (const program of programs) {
    const ratios = program.flatMap((r) => {
      const u = usual(r);
      return u && u > 0 ? [r.minutes / u] : [];
    });
    const factor = ratios.length >= 3 ? median(ratios) : 1;
    for (const r of program) factors.set(r, factor);
  }
  return factors;
}

/**
 * Scheduled runs (or runs of unknown cause) against the zone's recent runs: median + k·scaled MAD, and at least
 * `longRunMinRatio` × the median. Each run is first divided by its program's factor for the night, so a hot week or
 * a raised seasonal adjustment that lengthens every zone alike is not one zone running away. Manual runs are
 * neither judged nor part of the history: a crew testing a zone by hand is not a schedule.
 */
export function detectLongRuns(runs: readonly ZoneRun[], ctx: WatchContext): Finding[] {
  const t = ctx.thresholds;
  const judgedRuns = runs.filter((r) => runWatered(r) && r.cause !== 'manual').sort((a, b) => a.startUtc - b.startUtc);
  // First pass: each zone's usual run before each of its runs (the plain median of its recent history).
  const usualBefore = new Map<ZoneRun, number | null>();
  const histories = new Map<string, number[]>();
  for (const run of judgedRuns) {
    const history = (histories.get(run.zoneId) ?? []).slice(-t.longRunHistoryRuns);
    usualBefore.set(run, history.length >= t.longRunMinHistoryRuns ? median(history) : null);
    histories.set(run.zoneId, [...history, run.minutes]);
  }
  const factors = programFactors(judgedRuns, (r) => usualBefore.get(r) ?? null);
  const findings: Finding[] = [];
  for (const zone of [...ctx.zones].sort((a, b) => a.zoneId.localeCompare(b.zoneId))) {
    const zoneRuns = judgedRuns.filter((r) => r.zoneId === zone.zoneId);
    const normal: number[] = [];
    const judged: RunJudgement[] = zoneRuns.map((run) => {
      const history = normal.slice(-t.longRunHistoryRuns);
      const adjusted = run.minutes / (factors.get(run) ?? 1);
      let usual: number | null = null;
      let long = false;
      if (history.length >= t.longRunMinHistoryRuns) {
        const limit = robustUpperLimit(history, t.longRunMadK, 0);
        usual = limit.median;
        long = adjusted > Math.max(limit.limit, limit.median * t.longRunMinRatio);
      }
      if (zone.scheduledMinutes !== undefined && zone.scheduledMinutes > 0) {
        usual ??= zone.scheduledMinutes;
        long ||= run.minutes > zone.scheduledMinutes * t.longRunScheduleRatio;
      }
      if (!long) normal.push(run.minutes);
      return { run, usualMinutes: usual, long };
    });
    const lastRun = zoneRuns[zoneRuns.length - 1];
    const episodes = groupConsecutive(judged, (a, b) => a.long && b.long).filter((g) => g[0]!.long);
    for (const episode of episodes) {
      const first = episode[0]!;
      const last = episode[episode.length - 1]!;
      const usual = first.usualMinutes!;
      const extraMinutes = episode.reduce((s, j) => s + Math.max(0, j.run.minutes - usual), 0);
      const lost = extraMinutes * zone.designGpm;
      const longest = Math.max(...episode.map((j) => j.run.minutes));
      const from = first.run.startUtc - 30 * 86_400_000;
      const shown = zoneRuns.filter((r) => r.startUtc >= from && r.startUtc <= last.run.startUtc);
      findings.push(
        completeFinding(
          {
            kind: 'runaway-zone',
            subKind: 'long-run',
            zoneId: zone.zoneId,
            periodStartUtc: first.run.startUtc,
            periodEndUtc: last.run.startUtc + last.run.minutes * 60_000,
            detectedAtUtc: first.run.startUtc + first.run.minutes * 60_000,
            ongoing: last.run === lastRun,
            evidence: {
              longRuns: episode.length,
              longestMinutes: longest,
              usualMinutes: usual,
              extraMinutes,
              designGpm: zone.designGpm,
            },
            series: [
              {
                label: `${zoneName(ctx.zones, zone.zoneId)} run length, minutes`,
                unit: 'min',
                points: shown.map((r) => ({ atUtc: r.startUtc, value: r.minutes })),
              },
            ],
            waterLostGal: lost,
            explanation:
              `${zoneName(ctx.zones, zone.zoneId)} ran up to ${longest} minutes ` +
              `where it usually runs ${Math.round(usual)}, ${episode.length} ` +
              `time${episode.length === 1 ? '' : 's'}, about ${gal(lost)} extra: ` +
              'check the program, the seasonal adjustment and the valve.',
            pricingMonth: localHourOf(first.run.startUtc, ctx.site.timeZone).month,
          },
          ctx.site,
          t,
        ),
      );
    }
  }
  return findings;
}

/**
 * Flow in the irrigation window while no zone runs, at least a set share of the smallest zone's design flow:
 * below that it looks like a leak (leak-detection.ts), above it like a whole zone's worth of water.
 * Flagged hours less than a day apart belong to the same episode, since a stuck valve flows night after night.
 */
export function detectOpenValve(timeline: readonly TimelineHour[], ctx: WatchContext): Finding[] {
  const t = ctx.thresholds;
  const known = ctx.zones.filter((z) => z.designGpm > 0);
  const limitGpm =
    known.length > 0
      ? t.openValveShareOfSmallestZone * Math.min(...known.map((z) => z.designGpm))
      : t.openValveFallbackGpm;
  const limitGph = limitGpm * 60;
  const lastHour = timeline[timeline.length - 1]?.startUtc ?? 0;
  const open = timeline.filter(
    (h) =>
      h.gallons !== null &&
      h.shares.length === 0 &&
      inLocalWindow(h.local.hour, ctx.site.irrigationWindow) &&
      h.gallons >= limitGph,
  );
  const episodes = groupConsecutive(open, (a, b) => b.startUtc - a.startUtc <= 24 * HOUR_MS).filter(
    (g) => g.length >= t.openValveMinHours,
  );
  return episodes.map((episode) => {
    const start = episode[0]!.startUtc;
    const end = episode[episode.length - 1]!.startUtc + HOUR_MS;
    const rateGph = median(episode.map((h) => h.gallons!));
    // Between flagged nights the valve most likely kept flowing; the days count too.
    const lost = rateGph * ((end - start) / HOUR_MS);
    const likely =
      known.length > 0
        ? [...known].sort((a, b) => Math.abs(a.designGpm * 60 - rateGph) - Math.abs(b.designGpm * 60 - rateGph))[0]!
        : null;
    return completeFinding(
      {
        kind: 'runaway-zone',
        subKind: 'open-valve',
        periodStartUtc: start,
        periodEndUtc: end,
        detectedAtUtc: itemAtCount(episode, t.openValveMinHours).startUtc + HOUR_MS,
        ongoing: lastHour - episode[episode.length - 1]!.startUtc < 24 * HOUR_MS,
        evidence: {
          openHours: episode.length,
          medianGph: rateGph,
          limitGph,
          ...(likely ? { closestZoneGpm: likely.designGpm } : {}),
        },
        series: [
          {
            label: 'Meter, gallons per hour',
            unit: 'gal/h',
            points: timeline
              .filter((h) => h.startUtc >= start - 24 * HOUR_MS && h.startUtc < end && h.gallons !== null)
              .map((h) => ({ atUtc: h.startUtc, value: h.gallons! })),
          },
        ],
        waterLostGal: lost,
        explanation:
          `Water flowed at about ${gal(rateGph)} an hour in the watering ` +
          'window while the controller ran no zone' +
          (likely ? ` (close to ${zoneName(ctx.zones, likely.zoneId)}'s flow)` : '') +
          ': ' +
          `a valve is probably stuck open, about ${gal(lost)} so far.`,
        pricingMonth: episode[0]!.local.month,
      },
      ctx.site,
      t,
    );
  });
}
