/**
 * Pure month-close figures: how much of a month is metered, and a portfolio's totals that add only like with like.
 */
import { daysInMonth } from '../portfolio/period';

/** Days of `month` expected by `today` (the site's local date): all of a past month, none of a future one. */
export function expectedDaysOf(month: string, today: string): number {
  if (month < today.slice(0, 7)) return daysInMonth(month);
  if (month > today.slice(0, 7)) return 0;
  return Number(today.slice(8, 10));
}

/** Share 0..1 of the expected days with metered use; a month with nothing expected yet counts as complete. */
export function meteredShare(meteredDays: number, expectedDays: number): number {
  if (expectedDays <= 0) return 1;
  return Math.min(meteredDays, expectedDays) / expectedDays;
}

export interface MonthFigures {
  useGallons: number | null;
  budgetGallons: number | null;
  cost: number | null;
  currency: string | null;
  openAlerts: number;
}

/**
 * Totals over sites: use adds every metered site; the budget only when every site has one (else null, so a
 * percentage never compares all use against part of the budget); money only in a single currency.
 */
export function totalsOf(rows: readonly MonthFigures[]): {
  useGallons: number;
  budgetGallons: number | null;
  cost: number | null;
  currency: string | null;
  openAlerts: number;
  /** Use against budget over the sites that have both, and how many those are. */
  percentOfBudget: number | null;
  comparedSites: number;
} {
  const compared = rows.filter((r) => r.useGallons !== null && r.budgetGallons !== null && r.budgetGallons > 0);
  const comparedBudget = compared.reduce((s, r) => s + r.budgetGallons!, 0);
  const currencies = new Set(rows.filter((r) => r.cost !== null).map((r) => r.currency));
  const allBudgeted = rows.length > 0 && rows.every((r) => r.budgetGallons !== null);
  const anyCost = rows.some((r) => r.cost !== null);
  return {
    useGallons: rows.reduce((s, r) => s + (r.useGallons ?? 0), 0),
    budgetGallons: allBudgeted ? rows.reduce((s, r) => s + r.budgetGallons!, 0) : null,
    cost: anyCost && currencies.size === 1 ? Math.round(rows.reduce((s, r) => s + (r.cost ?? 0), 0) * 100) / 100 : null,
    currency: currencies.size === 1 ? ([...currencies][0] ?? null) : null,
    openAlerts: rows.reduce((s, r) => s + r.openAlerts, 0),
    percentOfBudget: compared.length ? (100 * compared.reduce((s, r) => s + r.useGallons!, 0)) / comparedBudget : null,
    comparedSites: compared.length,
  };
}

/** Today's date in a time zone, YYYY-MM-DD. */
export function localDateIn(timeZone: string, at = new Date()): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(at);
}
