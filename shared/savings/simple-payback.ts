/**
 * Simple payback of a retrofit: installed cost ÷ money saved per year, the year's savings scaled from the days the
 * reporting months cover. No discounting, no price changes: the plain figure a board asks for first.
 */
export const DAYS_PER_YEAR = 365.25;

export interface PaybackInput {
  installedCost: number | null;
  /** Money saved over the reporting months so far; null when unpriced. */
  savedMoney: number | null;
  reportingDays: number;
}

/** Years to pay back; null when it cannot be said (no cost, no price, nothing saved, no reporting days). */
export function simplePaybackYears({ installedCost, savedMoney, reportingDays }: PaybackInput): number | null {
  if (installedCost === null || savedMoney === null || !(reportingDays > 0) || !(savedMoney > 0)) return null;
  if (!(installedCost >= 0)) throw new RangeError(`An installed cost must be zero or more (got ${installedCost})`);
  const perYear = (savedMoney * DAYS_PER_YEAR) / reportingDays;
  return installedCost / perYear;
}

/** Money saved per year at the pace of the reporting months so far; null without a price or reporting days. */
export function annualSavings(savedMoney: number | null, reportingDays: number): number | null {
  if (savedMoney === null || !(reportingDays > 0)) return null;
  return (savedMoney * DAYS_PER_YEAR) / reportingDays;
}
