/**
 * Overspend: the month's use running ahead of its budget, judged each day from `overspendMinDays` on.
 * Month-to-date compares use so far with the budget prorated to the same day (following the daily budgets' shape
 * when given, else the calendar); projected adds the recent daily pace for the days left. The pace stays inside
 * the month (last month's use says nothing of this one's) and is judged once it spans a full window.
 */
import { costOfGap } from '../rates/water-cost';
import { formatVolume } from '../units/format-quantity';
import { completeFinding, type Finding, type FindingSubKind } from './finding';
import type { TimelineHour } from './hour-timeline';
import { daysInMonthKey, localMidnightUtc, nextDate } from './site-clock';
import type { WatchContext } from './watch-inputs';

const gal = (v: number) => formatVolume(v, 'gal');

interface DayState {
  date: string;
  dayOfMonth: number;
  useSoFar: number;
  proratedBudget: number;
  projected: number;
  overToDate: boolean;
  overProjected: boolean;
}

function dailyTotals(timeline: readonly TimelineHour[]): Map<string, number> {
  const totals = new Map<string, number>();
  for (const h of timeline)
    if (h.gallons !== null) totals.set(h.local.date, (totals.get(h.local.date) ?? 0) + h.gallons);
  return totals;
}

function monthStates(month: string, budget: number, totals: Map<string, number>, ctx: WatchContext): DayState[] {
  const t = ctx.thresholds;
  const days = daysInMonthKey(month);
  const daily = new Map((ctx.site.dailyBudgets ?? []).map((d) => [d.date, d.gallons]));
  const monthDates = Array.from({ length: days }, (_, i) => `${month}-${String(i + 1).padStart(2, '0')}`);
  const followDaily = monthDates.every((d) => daily.has(d));
  const lastDataDate = [...totals.keys()]
    .filter((d) => d.startsWith(month))
    .sort()
    .pop();
  if (!lastDataDate) return [];
  const states: DayState[] = [];
  let useSoFar = 0;
  let budgetSoFar = 0;
  const recent: number[] = [];
  for (const date of monthDates) {
    if (date > lastDataDate) break;
    const dayOfMonth = Number(date.slice(8));
    const used = totals.get(date) ?? 0;
    useSoFar += used;
    budgetSoFar += followDaily ? daily.get(date)! : budget / days;
    if (totals.has(date)) recent.push(used);
    if (dayOfMonth < t.overspendMinDays) continue;
    const window = recent.slice(-t.projectionRecentDays);
    const pace = window.length > 0 ? window.reduce((s, v) => s + v, 0) / window.length : 0;
    const projected = useSoFar + pace * (days - dayOfMonth);
    states.push({
      date,
      dayOfMonth,
      useSoFar,
      proratedBudget: budgetSoFar,
      projected,
      overToDate: useSoFar > t.monthToDateRatio * budgetSoFar,
      // Only a full window is a fair pace: seven days of an every-other-day schedule hold three or four waterings.
      overProjected: window.length >= t.projectionRecentDays && projected > t.projectedRatio * budget,
    });
  }
  return states;
}

export function detectOverspend(timeline: readonly TimelineHour[], ctx: WatchContext): Finding[] {
  const totals = dailyTotals(timeline);
  const lastDate = timeline[timeline.length - 1]?.local.date;
  const findings: Finding[] = [];
  for (const { month, gallons: budget } of [...ctx.site.monthlyBudgets].sort((a, b) =>
    a.month.localeCompare(b.month),
  )) {
    if (!(budget > 0)) continue;
    const states = monthStates(month, budget, totals, ctx);
    const latest = states[states.length - 1];
    if (!latest) continue;
    const subKinds: Array<[FindingSubKind, (s: DayState) => boolean]> = [
      ['month-to-date', (s) => s.overToDate],
      ['projected-month-end', (s) => s.overProjected],
    ];
    for (const [subKind, over] of subKinds) {
      const flagged = states.filter(over);
      if (flagged.length === 0) continue;
      const lostSoFar = Math.max(0, latest.useSoFar - latest.proratedBudget);
      const projectedExtra = Math.max(0, latest.projected - budget);
      const evidence: Record<string, number> = {
        daysFlagged: flagged.length,
        firstFlaggedDayOfMonth: flagged[0]!.dayOfMonth,
        useSoFarGal: latest.useSoFar,
        proratedBudgetGal: latest.proratedBudget,
        monthBudgetGal: budget,
        projectedGal: latest.projected,
        ...(ctx.site.rateSchedule
          ? { projectedExtraCost: costOfGap(ctx.site.rateSchedule, Math.max(latest.projected, budget), budget).gapCost }
          : {}),
      };
      const stillOver = over(latest);
      const percent = ((latest.useSoFar / latest.proratedBudget) * 100).toFixed(0);
      const flaggedDays = `${flagged.length} day${flagged.length === 1 ? '' : 's'} (first on ${flagged[0]!.date})`;
      // A month that went over and came back says so, rather than "over by 0 gal".
      const explanation =
        subKind === 'month-to-date'
          ? stillOver
            ? `By ${latest.date} the site had used ${gal(latest.useSoFar)} ` +
              `this month against ${gal(latest.proratedBudget)} budgeted for ` +
              `those days (${percent} %).`
            : `Over its budget so far on ${flaggedDays}; by ${latest.date} ` +
              `${gal(latest.useSoFar)} against ${gal(latest.proratedBudget)} ` +
              `budgeted for those days (${percent} %), under the alert line again.`
          : stillOver
            ? `At the pace of the last days, ${month} would end near ${gal(latest.projected)}, ` +
              `over its ${gal(budget)} budget by ${gal(projectedExtra)}.`
            : `On ${flaggedDays} the pace pointed past ${month}'s ${gal(budget)} ` +
              `budget; by ${latest.date} it pointed to about ${gal(latest.projected)}, ` +
              'under the alert line again.';
      findings.push(
        completeFinding(
          {
            kind: 'overspend',
            subKind,
            // The month is the budget period and its excess builds from day 1: one finding per month and kind.
            periodStartUtc: localMidnightUtc(`${month}-01`, ctx.site.timeZone),
            detectedAtUtc: localMidnightUtc(nextDate(flagged[0]!.date), ctx.site.timeZone),
            periodEndUtc: localMidnightUtc(nextDate(latest.date), ctx.site.timeZone),
            ongoing: over(latest) && latest.date === lastDate,
            evidence,
            series: [
              {
                label: 'Use so far this month, gallons',
                unit: 'gal',
                points: states.map((s) => ({ atUtc: localMidnightUtc(s.date, ctx.site.timeZone), value: s.useSoFar })),
              },
              {
                label: 'Budget so far, gallons',
                unit: 'gal',
                points: states.map((s) => ({
                  atUtc: localMidnightUtc(s.date, ctx.site.timeZone),
                  value: s.proratedBudget,
                })),
              },
            ],
            waterLostGal: lostSoFar,
            explanation,
            pricingMonth: month,
          },
          ctx.site,
          ctx.thresholds,
        ),
      );
    }
  }
  return findings;
}
