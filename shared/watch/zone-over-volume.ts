/**
 * Runaway zone, over-volume: a zone drawing well above its design flow × minutes (a broken lateral, a missing
 * nozzle, a split drip line). With a controller flow sensor each run is measured directly. With only the site's
 * hourly meter, zones share hours, so extra water is pinned on a zone only when the watering's other hours look
 * normal; otherwise the run is left unjudged rather than blamed on a neighbour.
 */
import { formatVolume } from '../units/format-quantity';
import { completeFinding, type Finding, type FindingDraft } from './finding';
import { groupConsecutive, itemAtCount, type TimelineHour } from './hour-timeline';
import { median } from './robust-statistics';
import { localHourOf } from './site-clock';
import { runWatered, zoneName, type WatchContext, type ZoneRun } from './watch-inputs';

interface RunCheck {
  runIndex: number;
  expectedGal: number;
  measuredGal: number;
  heavy: boolean;
}

/** Meter rounding allowance per hour when comparing with design: registers move in whole gallons. */
const ROUNDING_GAL = 2;

function checksFromSensor(runs: readonly ZoneRun[], gpm: Map<string, number>, ctx: WatchContext): RunCheck[] {
  const t = ctx.thresholds;
  const checks: RunCheck[] = [];
  runs.forEach((run, runIndex) => {
    const design = gpm.get(run.zoneId);
    if (!runWatered(run) || run.measuredGallons === undefined || !design) return;
    const expectedGal = design * run.minutes;
    const measuredGal = run.measuredGallons;
    checks.push({
      runIndex,
      expectedGal,
      measuredGal,
      heavy: isHeavy(expectedGal, measuredGal, t.overVolumeRatio, t.overVolumeMinExcessGal),
    });
  });
  return checks;
}

const runEnd = (run: ZoneRun) => run.startUtc + run.minutes * 60_000;

function isHeavy(expectedGal: number, measuredGal: number, ratio: number, minExcess: number): boolean {
  return expectedGal > 0 && measuredGal >= ratio * expectedGal && measuredGal - expectedGal >= minExcess;
}

/** Flow with no zone running, near a block: a leak's share of every hour, taken off before judging zones. */
function backgroundGph(timeline: readonly TimelineHour[], fromIndex: number, toIndex: number): number {
  const quiet: number[] = [];
  for (let i = Math.max(0, fromIndex - 12); i <= Math.min(timeline.length - 1, toIndex + 12); i++) {
    const h = timeline[i]!;
    if (h.shares.length === 0 && h.gallons !== null) quiet.push(h.gallons);
  }
  return quiet.length > 0 ? median(quiet) : 0;
}

function checksFromMeter(timeline: readonly TimelineHour[], runs: readonly ZoneRun[], ctx: WatchContext): RunCheck[] {
  const t = ctx.thresholds;
  const indexed = timeline.map((h, i) => ({ h, i })).filter(({ h }) => h.shares.length > 0);
  const blocks = groupConsecutive(indexed, (a, b) => b.i === a.i + 1);
  const checks: RunCheck[] = [];
  for (const block of blocks) {
    if (block.some(({ h }) => h.gallons === null)) continue;
    const base = backgroundGph(timeline, block[0]!.i, block[block.length - 1]!.i);
    const excess = block.map(({ h }) => h.gallons! - base - h.expectedGal);
    const zoneIds = new Set(block.flatMap(({ h }) => h.shares.map((s) => s.zoneId)));
    for (const zoneId of zoneIds) {
      const zoneRuns = new Set(
        block.flatMap(({ h }) => h.shares.filter((s) => s.zoneId === zoneId).map((s) => s.runIndex)),
      );
      // Runs with their own flow sensor are judged by it.
      if ([...zoneRuns].some((r) => runs[r]!.measuredGallons !== undefined)) continue;
      const own = block.map(({ h }) =>
        h.shares.filter((s) => s.zoneId === zoneId).reduce((s, x) => s + x.expectedGal, 0),
      );
      const expectedGal = own.reduce((s, v) => s + v, 0);
      if (expectedGal <= 0) continue;
      const extraGal = own.reduce((s, v, k) => s + (v > 0 ? excess[k]! : 0), 0);
      // Hours without this zone must look normal, or the extra water may be someone else's.
      const othersNormal = block.every(
        ({ h }, k) => own[k]! > 0 || Math.abs(excess[k]!) <= t.overVolumeHourTolerance * h.expectedGal + ROUNDING_GAL,
      );
      // A heavy zone shows extra in every hour it holds a real part of, more than design-record error could explain;
      // a neighbour sharing one heavy hour, or a small slice of an hour whose big zone runs a little high, does not.
      const everyHourHeavy = own.every(
        (v, k) =>
          v < 0.25 * expectedGal ||
          (1 + excess[k]! / v >= 1 + (t.overVolumeRatio - 1) / 2 &&
            excess[k]! > t.overVolumeHourTolerance * block[k]!.h.expectedGal + ROUNDING_GAL),
      );
      if (!othersNormal || !everyHourHeavy) continue;
      const measuredGal = expectedGal + extraGal;
      const heavy = isHeavy(expectedGal, measuredGal, t.overVolumeRatio, t.overVolumeMinExcessGal);
      // A zone run split over several starts in one block (cycle and soak) shares one verdict.
      const perRun = expectedGal / zoneRuns.size;
      for (const runIndex of zoneRuns)
        checks.push({ runIndex, expectedGal: perRun, measuredGal: measuredGal / zoneRuns.size, heavy });
    }
  }
  return checks;
}

export function detectOverVolume(
  timeline: readonly TimelineHour[],
  runs: readonly ZoneRun[],
  ctx: WatchContext,
): Finding[] {
  const t = ctx.thresholds;
  const gpm = new Map(ctx.zones.map((z) => [z.zoneId, z.designGpm]));
  const checks = [...checksFromSensor(runs, gpm, ctx), ...checksFromMeter(timeline, runs, ctx)];
  const byZone = new Map<string, RunCheck[]>();
  for (const c of checks) {
    const zoneId = runs[c.runIndex]!.zoneId;
    const list = byZone.get(zoneId);
    if (list) list.push(c);
    else byZone.set(zoneId, [c]);
  }
  const drafts: FindingDraft[] = [];
  for (const [zoneId, zoneChecks] of [...byZone].sort(([a], [b]) => a.localeCompare(b))) {
    zoneChecks.sort((a, b) => runs[a.runIndex]!.startUtc - runs[b.runIndex]!.startUtc);
    const lastIndex = zoneChecks[zoneChecks.length - 1]!.runIndex;
    const episodes = groupConsecutive(zoneChecks, (a, b) => a.heavy && b.heavy).filter(
      (g) => g[0]!.heavy && g.length >= t.overVolumeMinRuns,
    );
    for (const episode of episodes) {
      const firstRun = runs[episode[0]!.runIndex]!;
      const lastRun = runs[episode[episode.length - 1]!.runIndex]!;
      const lost = episode.reduce((s, c) => s + (c.measuredGal - c.expectedGal), 0);
      const ratio = median(episode.map((c) => c.measuredGal / c.expectedGal));
      const recent = zoneChecks.filter(
        (c) =>
          runs[c.runIndex]!.startUtc >= firstRun.startUtc - 30 * 86_400_000 &&
          runs[c.runIndex]!.startUtc <= lastRun.startUtc,
      );
      const at = (c: RunCheck) => runs[c.runIndex]!.startUtc;
      drafts.push({
        kind: 'runaway-zone',
        subKind: 'over-volume',
        zoneId,
        periodStartUtc: firstRun.startUtc,
        periodEndUtc: runEnd(lastRun),
        detectedAtUtc: runEnd(runs[itemAtCount(episode, t.overVolumeMinRuns).runIndex]!),
        ongoing: episode[episode.length - 1]!.runIndex === lastIndex,
        evidence: { heavyRuns: episode.length, medianRatio: ratio, designGpm: gpm.get(zoneId) ?? 0, extraGal: lost },
        series: [
          {
            label: `${zoneName(ctx.zones, zoneId)} measured per run, gallons`,
            unit: 'gal',
            points: recent.map((c) => ({ atUtc: at(c), value: c.measuredGal })),
          },
          {
            label: `${zoneName(ctx.zones, zoneId)} design flow × minutes, gallons`,
            unit: 'gal',
            points: recent.map((c) => ({ atUtc: at(c), value: c.expectedGal })),
          },
        ],
        waterLostGal: lost,
        explanation:
          `${zoneName(ctx.zones, zoneId)} used ${ratio.toFixed(1)} times ` +
          `its design flow on ${episode.length} runs in a row, about ${formatVolume(lost, 'gal')} ` +
          'extra: look for a broken pipe, a missing nozzle or a split drip line.',
        pricingMonth: localHourOf(firstRun.startUtc, ctx.site.timeZone).month,
      });
    }
  }
  const findings = overlappingGroups(drafts).map((group) =>
    completeFinding(group.length === 1 ? group[0]! : mergeSuspects(group, ctx), ctx.site, t),
  );
  return findings;
}

/** Drafts whose periods overlap, transitively: zones blamed for the same heavy waterings. */
function overlappingGroups(drafts: FindingDraft[]): FindingDraft[][] {
  const sorted = [...drafts].sort(
    (a, b) => a.periodStartUtc - b.periodStartUtc || (a.zoneId ?? '').localeCompare(b.zoneId ?? ''),
  );
  const groups: FindingDraft[][] = [];
  let reach = Number.NEGATIVE_INFINITY;
  for (const d of sorted) {
    const current = groups[groups.length - 1];
    if (current && d.periodStartUtc < reach) {
      current.push(d);
      reach = Math.max(reach, d.periodEndUtc);
    } else {
      groups.push([d]);
      reach = d.periodEndUtc;
    }
  }
  return groups;
}

/**
 * Several zones blamed at once: with only hourly meter data, zones that share the same hours (cycle and soak)
 * cannot always be told apart. One finding for them all rather than one alert per zone; its water is the largest
 * single estimate, since each zone's estimate counts the same extra water. When one zone was heavy on more runs
 * than any other it is named as the most likely, with that reason; otherwise they are listed by name.
 */
function mergeSuspects(group: FindingDraft[], ctx: WatchContext): FindingDraft {
  const byRuns = [...group].sort(
    (a, b) =>
      (b.evidence['heavyRuns'] ?? 0) - (a.evidence['heavyRuns'] ?? 0) || (a.zoneId ?? '').localeCompare(b.zoneId ?? ''),
  );
  const zones = group.map((d) => d.zoneId!).sort();
  const names = zones.map((z) => zoneName(ctx.zones, z));
  const biggest = group.reduce((a, b) => ((b.waterLostGal ?? 0) > (a.waterLostGal ?? 0) ? b : a));
  const lost = biggest.waterLostGal ?? 0;
  const top = byRuns[0]!;
  const runnerUp = byRuns[1]!.evidence['heavyRuns'] ?? 0;
  const likely = (top.evidence['heavyRuns'] ?? 0) > runnerUp ? top : null;
  const { zoneId: _single, ...rest } = biggest;
  const ratio = biggest.evidence['medianRatio']!.toFixed(1);
  const others = names.filter((n) => !likely || n !== zoneName(ctx.zones, likely.zoneId!));
  const explanation = likely
    ? `${zoneName(ctx.zones, likely.zoneId!)} most likely used about ${ratio} times its design flow, about ` +
      `${formatVolume(lost, 'gal')} extra: it was heavy on ${likely.evidence['heavyRuns']} runs, while ` +
      `${listOf(others)}, which share its meter hours, were heavy on at most ${runnerUp}. ` +
      'Look for a broken pipe, a missing nozzle or a split drip line there first.'
    : `One of ${listOf(names, 'or')} used about ${ratio} times its design flow on several runs in a row, about ` +
      `${formatVolume(lost, 'gal')} extra; they run in the same meter hours (cycle and soak), so the meter cannot ` +
      'tell them apart: walk all of them.';
  return {
    ...rest,
    ...(likely ? { zoneId: likely.zoneId! } : {}),
    suspectZoneIds: zones,
    periodStartUtc: Math.min(...group.map((d) => d.periodStartUtc)),
    periodEndUtc: Math.max(...group.map((d) => d.periodEndUtc)),
    detectedAtUtc: Math.min(...group.map((d) => d.detectedAtUtc)),
    ongoing: group.some((d) => d.ongoing),
    evidence: { ...biggest.evidence, suspectZones: zones.length },
    series: group.flatMap((d) => d.series),
    explanation,
  };
}

/** "A, B and C" (or "A, B or C"). */
function listOf(names: readonly string[], last: 'and' | 'or' = 'and'): string {
  return names.length <= 1 ? (names[0] ?? '') : `${names.slice(0, -1).join(', ')} ${last} ${names[names.length - 1]}`;
}
