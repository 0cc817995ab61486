/**
 * One site's nightly check: every detector over the data given, findings in a stable order. Pure: the job loads
 * the data (with each detector's look-back), calls this, and files the findings by key.
 */
import { resolveThresholds } from './alert-thresholds';
import { estimateControllerShiftMinutes } from './controller-clock-skew';
import type { Finding } from './finding';
import { buildTimeline } from './hour-timeline';
import { detectContinuousFlow, detectMonthOverBudget, detectNightFlow } from './leak-detection';
import { detectOverspend } from './overspend-detection';
import { detectLongRuns, detectOpenValve } from './runaway-zone-detection';
import { detectNoReads, detectZeroWhileRunning } from './silent-meter-detection';
import type { SiteWatchInput, WatchContext } from './watch-inputs';
import { detectOverVolume } from './zone-over-volume';

export function watchSite(input: SiteWatchInput): Finding[] {
  const ctx: WatchContext = {
    site: input.site,
    zones: input.zones,
    thresholds: resolveThresholds(input.site.thresholds),
    asOfUtc: input.asOfUtc,
  };
  const findings: Finding[] = [...detectLongRuns(input.runs, ctx)];
  if (input.meterHours && input.meterHours.length > 0) {
    const shiftMinutes = estimateControllerShiftMinutes(
      input.meterHours,
      input.runs,
      input.zones,
      ctx.thresholds.controllerClockSearchMinutes,
    );
    const runs =
      shiftMinutes === 0 ? input.runs : input.runs.map((r) => ({ ...r, startUtc: r.startUtc + shiftMinutes * 60_000 }));
    const timeline = buildTimeline(input.meterHours, runs, input.zones, input.site.timeZone);
    findings.push(
      ...detectContinuousFlow(timeline, ctx),
      ...detectNightFlow(timeline, ctx),
      ...detectOverVolume(timeline, runs, ctx),
      ...detectOpenValve(timeline, ctx),
      ...detectOverspend(timeline, ctx),
      ...detectNoReads(timeline, ctx),
      ...detectZeroWhileRunning(timeline, ctx),
    );
  }
  if (input.monthlyUse && input.monthlyUse.length > 0) findings.push(...detectMonthOverBudget(input.monthlyUse, ctx));
  return findings.sort((a, b) => a.periodStartUtc - b.periodStartUtc || a.key.localeCompare(b.key));
}
