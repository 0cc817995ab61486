/**
 * Per-site figures for the auditor's compliance view: use against budget, and against the same period last year.
 */

/** actual / budget × 100; null when there is no budget to compare against (zero or missing). */
export function percentOfBudget(actualGal: number, budgetGal: number | null): number | null {
  if (!(actualGal >= 0)) throw new RangeError(`Use must be zero or more (got ${actualGal} gal)`);
  if (budgetGal === null || budgetGal === 0) return null;
  if (!(budgetGal > 0)) throw new RangeError(`A budget must be zero or more (got ${budgetGal} gal)`);
  return (100 * actualGal) / budgetGal;
}

/**
 * Percent change from last year's use to this year's, (this − last)/last × 100. Null when last year had no use
 * (or no data): any change from nothing is not a percentage.
 */
export function trendVsLastYear(thisYearGal: number, lastYearGal: number | null): number | null {
  if (!(thisYearGal >= 0)) throw new RangeError(`Use must be zero or more (got ${thisYearGal} gal)`);
  if (lastYearGal === null || lastYearGal === 0) return null;
  if (!(lastYearGal > 0)) throw new RangeError(`Last year's use must be zero or more (got ${lastYearGal} gal)`);
  return (100 * (thisYearGal - lastYearGal)) / lastYearGal;
}
