/**
 * The watch's view of a site's budget, from the budget engine's days: each month on its own, a day without weather
 * left out (the month marked partial with the days it covers), estimated days counted. The job and the quality
 * test build the detectors' budget input through this one function.
 */
import type { MonthBudget } from './watch-inputs';

export interface BudgetDayFact {
  date: string;
  /** Null when the day had no weather at all: the budget leaves it out. */
  gallons: number | null;
  /** True when the day's weather was estimated (the station's recent days or a neighbouring station). */
  estimated: boolean;
}

export interface BudgetFacts {
  monthlyBudgets: MonthBudget[];
  dailyBudgets: { date: string; gallons: number }[];
}

export function budgetFactsOf(days: readonly BudgetDayFact[]): BudgetFacts {
  const months = new Map<string, MonthBudget>();
  const dailyBudgets: BudgetFacts['dailyBudgets'] = [];
  for (const day of days) {
    if (day.gallons === null) continue;
    const key = day.date.slice(0, 7);
    const month = months.get(key) ?? { month: key, gallons: 0, coveredDays: 0, estimatedDays: 0 };
    month.gallons += day.gallons;
    month.coveredDays! += 1;
    if (day.estimated) month.estimatedDays! += 1;
    months.set(key, month);
    dailyBudgets.push({ date: day.date, gallons: day.gallons });
  }
  return { monthlyBudgets: [...months.values()].sort((a, b) => a.month.localeCompare(b.month)), dailyBudgets };
}
