/**
 * Repairs verified by the meter. After an alert is resolved as fixed, the watch keeps looking at the same
 * condition: a leak or an open valve is repaired when the lowest night flow is back to the site's usual night low;
 * a zone that used too much or ran too long when its next runs are back to design or to its usual minutes; a silent
 * meter when readings come in. The first REPAIR_NIGHTS nights (or runs) after the repair decide. Pure.
 */
import { resolveThresholds, type AlertThresholds } from './alert-thresholds';
import type { ChartSeries } from './finding';
import { buildTimeline, type TimelineHour } from './hour-timeline';
import { median } from './robust-statistics';
import { DAY_MS, HOUR_MS, inLocalWindow } from './site-clock';
import { runWatered, zoneName, type SiteWatchInput, type ZoneRun } from './watch-inputs';

/** Nights (or runs) after the repair that decide it (common practice, no source; docs/references.md §7). */
export const REPAIR_NIGHTS = 3;
/**
 * Allowed margin over the usual figure: the larger of this share and the night-flow threshold's own margin (common
 * practice, no source; docs/references.md §7).
 */
export const REPAIR_MARGIN_SHARE = 0.25;

export interface RepairToVerify {
  kind: string;
  subKind: string;
  zoneId: string | null;
  /** When the repair was done (the person's word); only data after it counts. */
  repairedAtUtc: number;
  /** The alert's own evidence numbers: the usual figures the repair must get back to. */
  evidence: Record<string, number>;
}

export type RepairVerdict =
  | { status: 'pending'; seen: number }
  | {
      status: 'verified' | 'not-verified';
      /** The end of the last night or run that decided it (data time). */
      decidedAtUtc: number;
      numbers: Record<string, number>;
      series: ChartSeries[];
      explanation: string;
    };

const NIGHT_KINDS = new Set(['continuous-flow', 'night-flow', 'open-valve']);

/** Sub-kinds whose repair the meter or the controller log can confirm (zone kinds need their zone). */
export function repairVerifiable(subKind: string, zoneId: string | number | null): boolean {
  if (NIGHT_KINDS.has(subKind) || subKind === 'no-reads') return true;
  return (subKind === 'over-volume' || subKind === 'long-run') && zoneId !== null;
}

/** The verdict, or null when the kind of alert is not something the meter can confirm (budgets, rules, weather). */
export function verifyRepair(repair: RepairToVerify, input: SiteWatchInput): RepairVerdict | null {
  const t = resolveThresholds(input.site.thresholds);
  if (NIGHT_KINDS.has(repair.subKind)) return verifyNightFlow(repair, input, t);
  if (repair.subKind === 'over-volume' && repair.zoneId) return verifyZoneVolume(repair, input, t);
  if (repair.subKind === 'long-run' && repair.zoneId) return verifyRunMinutes(repair, input);
  if (repair.subKind === 'no-reads') return verifyReadsBack(repair, input);
  return null;
}

interface NightLow {
  startUtc: number;
  endUtc: number;
  lowestGal: number;
}

/** Lowest quiet night hour of each local night (hours no zone watered), as the night-flow detector reads nights. */
function nightLows(timeline: readonly TimelineHour[], t: AlertThresholds): NightLow[] {
  const window = { startHour: t.nightStartHour, endHour: t.nightEndHour };
  const nights = new Map<string, NightLow & { quiet: number }>();
  for (const h of timeline) {
    if (h.gallons === null || h.shares.length > 0 || !inLocalWindow(h.local.hour, window)) continue;
    const key =
      h.local.hour >= window.startHour && window.startHour > window.endHour ? `${h.local.date}+` : h.local.date;
    const n = nights.get(key);
    if (!n) nights.set(key, { startUtc: h.startUtc, endUtc: h.startUtc + HOUR_MS, lowestGal: h.gallons, quiet: 1 });
    else {
      n.lowestGal = Math.min(n.lowestGal, h.gallons);
      n.endUtc = h.startUtc + HOUR_MS;
      n.quiet++;
    }
  }
  return [...nights.values()].filter((n) => n.quiet >= t.nightMinQuietHours).sort((a, b) => a.startUtc - b.startUtc);
}

function verifyNightFlow(repair: RepairToVerify, input: SiteWatchInput, t: AlertThresholds): RepairVerdict {
  const e = repair.evidence;
  const usual = e['usualNightLowGph'] ?? e['baselineMedianGph'] ?? e['usualLowGph'] ?? 0;
  const lows = nightLows(buildTimeline(input.meterHours ?? [], input.runs, input.zones, input.site.timeZone), t);
  const after = lows.filter((n) => n.startUtc >= repair.repairedAtUtc).slice(0, REPAIR_NIGHTS);
  if (after.length < REPAIR_NIGHTS) return { status: 'pending', seen: after.length };
  const limit = usual + Math.max(t.nightFlowMinExcessGph, usual * REPAIR_MARGIN_SHARE);
  const low = median(after.map((n) => n.lowestGal));
  const ok = low <= limit;
  const before = lows.filter(
    (n) => n.startUtc < repair.repairedAtUtc && n.startUtc >= repair.repairedAtUtc - 14 * DAY_MS,
  );
  const last = after[after.length - 1]!;
  const chart = [...before, ...after];
  return {
    status: ok ? 'verified' : 'not-verified',
    decidedAtUtc: last.endUtc,
    numbers: { nightsAfterRepair: after.length, medianNightLowGph: low, usualNightLowGph: usual, limitGph: limit },
    series: [
      {
        label: 'Lowest quiet night hour, gallons (before and after the repair)',
        unit: 'gal/h',
        points: chart.map((n) => ({ atUtc: n.startUtc, value: n.lowestGal })),
      },
      {
        label: 'Usual night low, gallons per hour',
        unit: 'gal/h',
        points: [chart[0]!, last].map((n) => ({ atUtc: n.startUtc, value: usual })),
      },
    ],
    explanation: ok
      ? `In the ${after.length} nights after the repair the quietest hour used ${gal(low)} (median), within ` +
        `${gal(limit)} of the usual ${gal(usual)}: the meter confirms the repair.`
      : `In the ${after.length} nights after the repair the quietest hour still used ${gal(low)} (median), above ` +
        `${gal(limit)} (usual ${gal(usual)}): water is still going somewhere.`,
  };
}

function zoneRunsAfter(repair: RepairToVerify, runs: readonly ZoneRun[]): ZoneRun[] {
  return runs
    .filter((r) => r.zoneId === repair.zoneId && r.startUtc >= repair.repairedAtUtc && runWatered(r))
    .sort((a, b) => a.startUtc - b.startUtc)
    .slice(0, REPAIR_NIGHTS);
}

function verifyZoneVolume(repair: RepairToVerify, input: SiteWatchInput, t: AlertThresholds): RepairVerdict {
  const gpm = input.zones.find((z) => z.zoneId === repair.zoneId)?.designGpm ?? repair.evidence['designGpm'] ?? 0;
  const measured = zoneRunsAfter(repair, input.runs).filter((r) => r.measuredGallons !== undefined);
  const ratios = measured.map((r) => ({
    at: r.startUtc,
    end: r.startUtc + r.minutes * 60_000,
    ratio: r.measuredGallons! / (gpm * r.minutes),
  }));
  const fromMeter = ratios.length
    ? []
    : soleZoneHours(repair, input).map((h) => ({
        at: h.startUtc,
        end: h.startUtc + HOUR_MS,
        ratio: h.gallons! / h.expectedGal,
      }));
  const all = (ratios.length ? ratios : fromMeter).filter((r) => Number.isFinite(r.ratio)).slice(0, REPAIR_NIGHTS);
  if (!(gpm > 0) || all.length < REPAIR_NIGHTS) return { status: 'pending', seen: all.length };
  const ratio = median(all.map((r) => r.ratio));
  const ok = ratio < t.overVolumeRatio;
  const name = zoneName(input.zones, repair.zoneId!);
  return {
    status: ok ? 'verified' : 'not-verified',
    decidedAtUtc: all[all.length - 1]!.end,
    numbers: { runsAfterRepair: all.length, medianRatio: ratio, limitRatio: t.overVolumeRatio, designGpm: gpm },
    series: [
      {
        label: `${name} use ÷ design flow × minutes, after the repair`,
        unit: 'gal',
        points: all.map((r) => ({ atUtc: r.at, value: r.ratio })),
      },
    ],
    explanation: ok
      ? `${name}'s next ${all.length} runs used ${ratio.toFixed(2)} times design flow (median), under ` +
        `${t.overVolumeRatio}: the meter confirms the repair.`
      : `${name}'s next ${all.length} runs still used ${ratio.toFixed(2)} times design flow (median).`,
  };
}

/** Meter hours after the repair in which this zone was the only one running (its volume is then all its own). */
function soleZoneHours(repair: RepairToVerify, input: SiteWatchInput): TimelineHour[] {
  const timeline = buildTimeline(input.meterHours ?? [], input.runs, input.zones, input.site.timeZone);
  return timeline.filter(
    (h) =>
      h.startUtc >= repair.repairedAtUtc &&
      h.gallons !== null &&
      h.expectedGal > 0 &&
      h.shares.length === 1 &&
      h.shares[0]!.zoneId === repair.zoneId &&
      h.shares[0]!.minutes >= 30,
  );
}

function verifyRunMinutes(repair: RepairToVerify, input: SiteWatchInput): RepairVerdict {
  const runs = zoneRunsAfter(repair, input.runs);
  if (runs.length < REPAIR_NIGHTS) return { status: 'pending', seen: runs.length };
  const usual = repair.evidence['usualMinutes'] ?? 0;
  const limit = usual * (1 + REPAIR_MARGIN_SHARE);
  const minutes = median(runs.map((r) => r.minutes));
  const ok = usual > 0 && minutes <= limit;
  const name = zoneName(input.zones, repair.zoneId!);
  const last = runs[runs.length - 1]!;
  return {
    status: ok ? 'verified' : 'not-verified',
    decidedAtUtc: last.startUtc + last.minutes * 60_000,
    numbers: { runsAfterRepair: runs.length, medianMinutes: minutes, usualMinutes: usual, limitMinutes: limit },
    series: [
      {
        label: `${name} run length after the repair, minutes`,
        unit: 'min',
        points: runs.map((r) => ({ atUtc: r.startUtc, value: r.minutes })),
      },
    ],
    explanation: ok
      ? `${name}'s next ${runs.length} runs lasted ${minutes} min (median), within ${Math.round(limit)} min of its ` +
        `usual ${usual} min: the controller log confirms the repair.`
      : `${name}'s next ${runs.length} runs still lasted ${minutes} min (median), against a usual ${usual} min.`,
  };
}

function verifyReadsBack(repair: RepairToVerify, input: SiteWatchInput): RepairVerdict {
  const days = new Map<number, number>();
  for (const h of input.meterHours ?? []) {
    if (h.startUtc < repair.repairedAtUtc) continue;
    const day = Math.floor((h.startUtc - repair.repairedAtUtc) / DAY_MS);
    days.set(day, Math.max(days.get(day) ?? 0, h.startUtc + HOUR_MS));
  }
  const seen = [...days.keys()].sort((a, b) => a - b).slice(0, REPAIR_NIGHTS);
  if (seen.length < REPAIR_NIGHTS) return { status: 'pending', seen: seen.length };
  return {
    status: 'verified',
    decidedAtUtc: days.get(seen[seen.length - 1]!)!,
    numbers: { daysWithReadings: seen.length },
    series: [],
    explanation: `Readings came in on ${seen.length} days after the repair: the meter is reporting again.`,
  };
}

function gal(v: number): string {
  return `${v.toFixed(1)} gal/h`;
}
