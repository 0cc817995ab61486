/** The monthly table's totals row over the months shown (twelve by default: the year ending at the chosen month). */
import { percentOf, type MonthlyRow } from './readings-dto';

export type MonthlyTotals = Omit<MonthlyRow, 'month' | 'flags'> & {
  /** Months in the range, and how many of them have readings and a budget. */
  months: number;
  meteredMonths: number;
  budgetedMonths: number;
};

const sum = (values: number[]): number => values.reduce((s, v) => s + v, 0);

/**
 * Use adds every month; budget, variance and percent compare only the months that have both readings and a
 * budget (so a year is never "under budget" because some months had no data); cost adds only in one currency.
 */
export function monthlyTotals(rows: readonly MonthlyRow[]): MonthlyTotals {
  const metered = rows.filter((r) => !r.flags.includes('no-data'));
  const compared = metered.filter((r) => r.budgetGallons !== null);
  const costed = rows.filter((r) => r.cost !== null);
  const currencies = new Set(costed.map((r) => r.currency));
  const comparedUse = sum(compared.map((r) => r.useGallons));
  const budget = compared.length ? sum(compared.map((r) => r.budgetGallons!)) : null;
  const withWeather = rows.filter((r) => r.etoMm !== null);
  return {
    months: rows.length,
    meteredMonths: metered.length,
    budgetedMonths: compared.length,
    useGallons: sum(rows.map((r) => r.useGallons)),
    budgetGallons: budget,
    varianceGallons: budget === null ? null : comparedUse - budget,
    percentOfBudget: percentOf(comparedUse, budget),
    etoMm: withWeather.length === rows.length && rows.length ? sum(withWeather.map((r) => r.etoMm!)) : null,
    rainMm: withWeather.length === rows.length && rows.length ? sum(withWeather.map((r) => r.rainMm ?? 0)) : null,
    cost: costed.length && currencies.size === 1 ? Math.round(sum(costed.map((r) => r.cost!)) * 100) / 100 : null,
    currency: currencies.size === 1 ? ([...currencies][0] ?? null) : null,
  };
}
