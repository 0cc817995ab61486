/**
 * Leaks on sites read once a month: a month using far more than its budget. Hourly sites: leak-detection.ts.
 */
import { formatVolume } from '../units/format-quantity';
import { completeFinding, type Finding } from './finding';
import { daysInMonthKey, localMidnightUtc } from './site-clock';
import type { MonthlyUse, WatchContext } from './watch-inputs';

const gal = (v: number) => formatVolume(v, 'gal');

/** Monthly-read sites: a month at `monthlyLeakRatio` × budget or more (common practice, no source). */
export function detectMonthOverBudget(monthlyUse: readonly MonthlyUse[], ctx: WatchContext): Finding[] {
  const t = ctx.thresholds;
  const budgets = new Map(ctx.site.monthlyBudgets.map((b) => [b.month, b]));
  const findings: Finding[] = [];
  for (const use of [...monthlyUse].sort((a, b) => a.month.localeCompare(b.month))) {
    const b = budgets.get(use.month);
    if (!b || b.gallons <= 0) continue;
    // A partial month's budget covers only the days with weather: scaled to the whole month to judge a whole read.
    const days = daysInMonthKey(use.month);
    const budget = (b.gallons * days) / Math.min(days, b.coveredDays ?? days);
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
          scope: use.month,
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
            'extra usually means a leak.' +
            (budget !== b.gallons ? ` The budget was scaled up from the ${b.coveredDays} days with weather.` : ''),
          pricingMonth: use.month,
        },
        ctx.site,
        t,
      ),
    );
  }
  return findings;
}
