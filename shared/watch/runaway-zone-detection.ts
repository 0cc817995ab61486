/**
 * Runaway zone, from the controller's side: a zone running much longer than its history or its schedule.
 * Over-volume against design flow lives in zone-over-volume.ts, a valve stuck open in open-valve-detection.ts.
 */
import { formatVolume } from '../units/format-quantity';
import { completeFinding, type Finding } from './finding';
import { groupConsecutive } from './hour-timeline';
import { median, robustUpperLimit } from './robust-statistics';
import { localHourOf } from './site-clock';
import { runWatered, zoneName, type WatchContext, type ZoneRun } from './watch-inputs';

const gal = (v: number) => formatVolume(v, 'gal');

interface RunJudgement {
  run: ZoneRun;
  usualMinutes: number | null;
  long: boolean;
}

interface WateringDay {
  /** Local date of the day's first run. */
  date: string;
  runs: RunJudgement[];
  long: boolean;
}

/** A zone's runs within this long of the day's first run belong to the same watering day (cycle and soak). */
const WATERING_DAY_MS = 12 * 3_600_000;

function wateringDays(judged: readonly RunJudgement[], timeZone: string): WateringDay[] {
  const days: WateringDay[] = [];
  for (const j of judged) {
    let current = days[days.length - 1];
    if (!current || j.run.startUtc - current.runs[0]!.run.startUtc >= WATERING_DAY_MS) {
      current = { date: localHourOf(j.run.startUtc, timeZone).date, runs: [], long: false };
      days.push(current);
    }
    current.runs.push(j);
    current.long ||= j.long;
  }
  return days;
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
    // One alert per group of watering days that ran long, closed by the first day the zone ran normally again.
    const days = wateringDays(judged, ctx.site.timeZone);
    const episodes = groupConsecutive(days, (a, b) => a.long && b.long).filter((g) => g[0]!.long);
    for (const episode of episodes) {
      const longRuns = episode.flatMap((d) => d.runs.filter((j) => j.long));
      const first = longRuns[0]!;
      const last = episode[episode.length - 1]!.runs[episode[episode.length - 1]!.runs.length - 1]!;
      const usual = first.usualMinutes!;
      const extraMinutes = longRuns.reduce((s, j) => s + Math.max(0, j.run.minutes - usual), 0);
      const lost = extraMinutes * zone.designGpm;
      const longest = Math.max(...longRuns.map((j) => j.run.minutes));
      const from = first.run.startUtc - 30 * 86_400_000;
      const shown = zoneRuns.filter((r) => r.startUtc >= from && r.startUtc <= last.run.startUtc);
      const dates = episode.map((d) => d.date);
      const name = zoneName(ctx.zones, zone.zoneId);
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
              longRuns: longRuns.length,
              wateringDays: dates.length,
              longestMinutes: longest,
              usualMinutes: usual,
              extraMinutes,
              designGpm: zone.designGpm,
            },
            series: [
              {
                label: `${name} run length, minutes`,
                unit: 'min',
                points: shown.map((r) => ({ atUtc: r.startUtc, value: r.minutes })),
              },
            ],
            waterLostGal: lost,
            explanation:
              `${name} ran up to ${longest} minutes where it usually runs ${Math.round(usual)}, ` +
              `on ${dates.length} watering day${dates.length === 1 ? '' : 's'} in a row (${dates.join(', ')}), ` +
              `about ${gal(lost)} extra (the extra minutes × its design flow): ` +
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
