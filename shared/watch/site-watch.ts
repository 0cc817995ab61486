/**
 * One site's nightly check: every detector over the data given, findings in a stable order. Pure: the job loads
 * the data (with each detector's look-back), calls this, and files the findings by key.
 */
import { resolveThresholds } from './alert-thresholds';
import { estimateControllerShiftMinutes } from './controller-clock-skew';
import type { Finding } from './finding';
import { buildTimeline } from './hour-timeline';
import { detectLeaks } from './leak-detection';
import { detectMonthOverBudget } from './monthly-read-leak';
import { detectOverspend } from './overspend-detection';
import { detectOpenValve } from './open-valve-detection';
import { detectLongRuns } from './runaway-zone-detection';
import { detectNoReads, detectZeroWhileRunning } from './silent-meter-detection';
import { DAY_MS } from './site-clock';
import type { SiteWatchInput, WatchContext } from './watch-inputs';
import { detectOverVolume } from './zone-over-volume';
import { detectRuleBreaches } from './watering-rule-detection';

export function watchSite(input: SiteWatchInput): Finding[] {
  const ctx: WatchContext = {
    site: input.site,
    zones: input.zones,
    thresholds: resolveThresholds(input.site.thresholds),
    asOfUtc: input.asOfUtc,
  };
  const findings: Finding[] = [...detectLongRuns(input.runs, ctx), ...detectRuleBreaches(input, ctx)];
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
    const valves = detectOpenValve(timeline, runs, ctx);
    findings.push(
      ...withoutWaterExplainedBy(valves, detectLeaks(timeline, ctx)),
      ...valves,
      ...detectOverVolume(timeline, runs, ctx),
      ...detectOverspend(timeline, ctx),
      ...detectNoReads(timeline, ctx),
      ...detectZeroWhileRunning(timeline, ctx),
    );
  }
  if (input.monthlyUse && input.monthlyUse.length > 0) findings.push(...detectMonthOverBudget(input.monthlyUse, ctx));
  return findings.sort((a, b) => a.periodStartUtc - b.periodStartUtc || a.key.localeCompare(b.key));
}

/** A valve stuck open is also flow that never stops: the valve's alert is the one alert for that water. */
function withoutWaterExplainedBy(valves: readonly Finding[], leaks: readonly Finding[]): Finding[] {
  return leaks.filter(
    (l) => !valves.some((v) => l.periodStartUtc < v.periodEndUtc + DAY_MS && v.periodStartUtc < l.periodEndUtc),
  );
}
