/**
 * Overspend: the month's use running ahead of its budget, judged each day from `overspendMinDays` on. One finding
 * per site and calendar month: the month-to-date comparison (use so far against the budget prorated to the same
 * day, following the daily budgets' shape when given, else the calendar) and the month-end projection (the recent
 * daily pace for the days left) are two views of the same gallons, so they travel in one alert. The pace stays
 * inside the month and is judged once it spans a full window. A partial month (weather missing for some days)
 * compares use and budget over the days its budget covers.
 */
import { costOfGap } from '../rates/water-cost';
import { formatVolume } from '../units/format-quantity';
import { completeFinding, type Finding } from './finding';
import type { TimelineHour } from './hour-timeline';
import { daysInMonthKey, localMidnightUtc, nextDate } from './site-clock';
import type { MonthBudget, WatchContext } from './watch-inputs';

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

interface MonthPlan {
  month: string;
  /** Budget of the covered days (the whole month's when complete). */
  budget: number;
  /** Covered dates with each one's budget. */
  days: Map<string, number>;
  partial: boolean;
  estimatedDays: number;
}

function dailyTotals(timeline: readonly TimelineHour[]): Map<string, number> {
  const totals = new Map<string, number>();
  for (const h of timeline)
    if (h.gallons !== null) totals.set(h.local.date, (totals.get(h.local.date) ?? 0) + h.gallons);
  return totals;
}

/** Which days the month's budget covers and what each is worth. */
function planMonth(b: MonthBudget, ctx: WatchContext): MonthPlan {
  const count = daysInMonthKey(b.month);
  const all = Array.from({ length: count }, (_, i) => `${b.month}-${String(i + 1).padStart(2, '0')}`);
  const daily = new Map(
    (ctx.site.dailyBudgets ?? []).filter((d) => d.date.startsWith(b.month)).map((d) => [d.date, d.gallons]),
  );
  const partial = b.coveredDays !== undefined && b.coveredDays < count;
  const followDaily = partial ? daily.size > 0 : all.every((d) => daily.has(d));
  const days = new Map<string, number>();
  // Without the daily shape a partial month is spread over its first covered days (the gap is usually at the end).
  const dates = followDaily ? all.filter((d) => daily.has(d)) : all.slice(0, partial ? b.coveredDays : count);
  for (const d of dates) days.set(d, followDaily ? daily.get(d)! : b.gallons / (b.coveredDays ?? count));
  return { month: b.month, budget: b.gallons, days, partial, estimatedDays: b.estimatedDays ?? 0 };
}

function monthStates(plan: MonthPlan, totals: Map<string, number>, ctx: WatchContext): DayState[] {
  const t = ctx.thresholds;
  const lastDataDate = [...totals.keys()]
    .filter((d) => d.startsWith(plan.month))
    .sort()
    .pop();
  if (!lastDataDate) return [];
  const states: DayState[] = [];
  let useSoFar = 0;
  let budgetSoFar = 0;
  let coveredSoFar = 0;
  const recent: number[] = [];
  for (const [date, dayBudget] of plan.days) {
    if (date > lastDataDate) break;
    const used = totals.get(date) ?? 0;
    useSoFar += used;
    budgetSoFar += dayBudget;
    coveredSoFar += 1;
    if (totals.has(date)) recent.push(used);
    const dayOfMonth = Number(date.slice(8));
    if (dayOfMonth < t.overspendMinDays) continue;
    const window = recent.slice(-t.projectionRecentDays);
    const pace = window.length > 0 ? window.reduce((s, v) => s + v, 0) / window.length : 0;
    const projected = useSoFar + pace * (plan.days.size - coveredSoFar);
    states.push({
      date,
      dayOfMonth,
      useSoFar,
      proratedBudget: budgetSoFar,
      projected,
      overToDate: useSoFar > t.monthToDateRatio * budgetSoFar,
      // Only a full window is a fair pace: seven days of an every-other-day schedule hold three or four waterings.
      overProjected: window.length >= t.projectionRecentDays && projected > t.projectedRatio * plan.budget,
    });
  }
  return states;
}

/** What the budget stands on, when it is not a plain whole month of measured weather. */
function budgetNote(plan: MonthPlan): string {
  const notes: string[] = [];
  if (plan.partial)
    notes.push(
      `The budget covers ${plan.days.size} of ${daysInMonthKey(plan.month)} days (no weather for the others); ` +
        'use is compared over the same days.',
    );
  if (plan.estimatedDays > 0)
    notes.push(`${plan.estimatedDays} day${plan.estimatedDays === 1 ? '' : 's'} of its weather were estimated.`);
  return notes.length ? ` ${notes.join(' ')}` : '';
}

function explain(plan: MonthPlan, latest: DayState, flagged: DayState[], monthOver: boolean): string {
  const percent = ((latest.useSoFar / latest.proratedBudget) * 100).toFixed(0);
  const toDate =
    `By ${latest.date} the site had used ${gal(latest.useSoFar)} in ${plan.month} against ` +
    `${gal(latest.proratedBudget)} budgeted for those days (${percent} %).`;
  const monthDone = latest.date === [...plan.days.keys()].pop();
  const projection = monthDone
    ? ''
    : latest.overProjected
      ? ` At the pace of the last days the month would end near ${gal(latest.projected)}, over its ` +
        `${gal(plan.budget)} budget by ${gal(latest.projected - plan.budget)}.`
      : ` At the pace of the last days the month would end near ${gal(latest.projected)} ` +
        `against its ${gal(plan.budget)} budget.`;
  // A month that went over and came back says so, rather than "over by 0 gal".
  const back = monthOver
    ? ''
    : ` It was over the alert line on ${flagged.length} day${flagged.length === 1 ? '' : 's'} ` +
      `(first on ${flagged[0]!.date}) and is under it again.`;
  return toDate + projection + back + budgetNote(plan);
}

function monthFinding(
  plan: MonthPlan,
  states: DayState[],
  lastDate: string | undefined,
  ctx: WatchContext,
): Finding | null {
  const flagged = states.filter((s) => s.overToDate || s.overProjected);
  const latest = states[states.length - 1];
  if (!latest || flagged.length === 0) return null;
  const zone = ctx.site.timeZone;
  const stillOver = latest.overToDate || latest.overProjected;
  const evidence: Record<string, number> = {
    daysFlagged: flagged.length,
    firstFlaggedDayOfMonth: flagged[0]!.dayOfMonth,
    useSoFarGal: latest.useSoFar,
    proratedBudgetGal: latest.proratedBudget,
    monthBudgetGal: plan.budget,
    projectedGal: latest.projected,
    budgetDays: plan.days.size,
    estimatedWeatherDays: plan.estimatedDays,
    ...(ctx.site.rateSchedule
      ? {
          projectedExtraCost: costOfGap(ctx.site.rateSchedule, Math.max(latest.projected, plan.budget), plan.budget)
            .gapCost,
        }
      : {}),
  };
  const at = (s: DayState) => localMidnightUtc(s.date, zone);
  return completeFinding(
    {
      kind: 'overspend',
      subKind: 'calendar-month',
      scope: plan.month,
      // The month is the budget period and its excess builds from day 1: one finding per month.
      periodStartUtc: localMidnightUtc(`${plan.month}-01`, zone),
      detectedAtUtc: localMidnightUtc(nextDate(flagged[0]!.date), zone),
      periodEndUtc: localMidnightUtc(nextDate(latest.date), zone),
      ongoing: stillOver && latest.date === lastDate,
      evidence,
      series: [
        {
          label: 'Use so far this month, gallons',
          unit: 'gal',
          points: states.map((s) => ({ atUtc: at(s), value: s.useSoFar })),
        },
        {
          label: 'Budget so far, gallons',
          unit: 'gal',
          points: states.map((s) => ({ atUtc: at(s), value: s.proratedBudget })),
        },
      ],
      waterLostGal: Math.max(0, latest.useSoFar - latest.proratedBudget),
      explanation: explain(plan, latest, flagged, stillOver),
      pricingMonth: plan.month,
    },
    ctx.site,
    ctx.thresholds,
  );
}

export function detectOverspend(timeline: readonly TimelineHour[], ctx: WatchContext): Finding[] {
  const totals = dailyTotals(timeline);
  const lastDate = timeline[timeline.length - 1]?.local.date;
  return [...ctx.site.monthlyBudgets]
    .filter((b) => b.gallons > 0)
    .sort((a, b) => a.month.localeCompare(b.month))
    .map((b) => planMonth(b, ctx))
    .flatMap((plan) => monthFinding(plan, monthStates(plan, totals, ctx), lastDate, ctx) ?? []);
}
