import { AppError, plainReason } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import { logger } from '../../../platform/logger';
import type { BudgetsService } from './budgets-service';
import { monthsBetween } from '@shared/portfolio/period';
import type { BudgetCacheRepository, BudgetMonthRow } from '../data/budget-cache-repository';

const PARALLEL = 4;

/**
 * Keeps `site_monthly_budget` filled from BudgetsService: the budget engine reads hydrozones, weather and
 * rates per site, far too slow to run for 1,000 sites on every portfolio request. Missing or stale
 * (site, month) rows are computed on demand with the asking user's access; a site whose budget can't be
 * computed (no hydrozones, no station, missing weather) gets rows with the reason and no gallons.
 */
export class BudgetCache {
  constructor(
    private readonly repo: BudgetCacheRepository,
    private readonly budgets: BudgetsService,
  ) {}

  /** The cached rows of these sites and months, as stored (call `ensure` first for fresh ones). */
  months(siteIds: number[], fromMonth: string, toMonth: string): Promise<BudgetMonthRow[]> {
    return this.repo.budgetMonths(siteIds, fromMonth, toMonth);
  }

  /** Sites among `siteIds` whose rows for these months are missing or stale. */
  staleSites(siteIds: number[], months: string[]): Promise<number[]> {
    return this.repo.staleBudgetSites(siteIds, months, new Date().toISOString().slice(0, 7));
  }

  /**
   * The engine's budget per day (following each day's ETo and effective rain) for these months, by date; empty when
   * the site cannot be budgeted. Not cached: the site pages ask for one site's few months.
   */
  async daily(principal: Principal, siteId: number, fromMonth: string, toMonth: string): Promise<Map<string, number>> {
    try {
      const budget = await this.budgets.budget(principal, siteId, fromMonth, toMonth, 'none');
      return new Map(budget.months.flatMap((m) => m.daily.map((d) => [d.date, d.gallons] as const)));
    } catch (error) {
      if (error instanceof AppError && error.code !== 'not_found' && error.code !== 'forbidden') return new Map();
      throw error;
    }
  }

  async ensure(principal: Principal, siteIds: number[], months: string[]): Promise<void> {
    const currentMonth = new Date().toISOString().slice(0, 7);
    const stale = await this.repo.staleBudgetSites(siteIds, months, currentMonth);
    const queue = [...stale];
    const worker = async () => {
      for (let id = queue.shift(); id !== undefined; id = queue.shift())
        await this.refresh(principal, id, months[0]!, months[months.length - 1]!);
    };
    await Promise.all(Array.from({ length: Math.min(PARALLEL, queue.length) }, worker));
  }

  async refresh(principal: Principal, siteId: number, fromMonth: string, toMonth: string): Promise<void> {
    let rows: BudgetMonthRow[];
    try {
      const budget = await this.budgets.budget(principal, siteId, fromMonth, toMonth, 'none');
      // A partial month keeps its budget for the days it covers, and says so; a month with no weather has none.
      rows = budget.months.map((m) => ({
        siteId,
        month: m.month,
        gallons: m.days > 0 ? m.gallons : null,
        cost: m.days > 0 ? (m.cost?.total ?? null) : null,
        currency: m.cost?.currency ?? null,
        etoMm: m.days > 0 ? m.etoMm : null,
        rainMm: m.days > 0 ? m.rainMm : null,
        filledDays: m.filledDays,
        problem: monthNote(m),
      }));
    } catch (error) {
      if (!(error instanceof AppError)) throw error;
      if (error.code === 'not_found' || error.code === 'forbidden') throw error;
      logger.debug('no budget for site', { siteId, reason: error.message });
      rows = monthsBetween(fromMonth, toMonth).map((month) => ({
        siteId,
        month,
        gallons: null,
        cost: null,
        currency: null,
        etoMm: null,
        rainMm: null,
        filledDays: 0,
        problem: plainReason(error),
      }));
    }
    await this.repo.saveBudgetMonths(rows);
  }
}

/** Why a month's budget is short or absent, in words; null for a whole month. */
export function monthNote(m: { month: string; days: number; partial: boolean; missingDates: string[] }): string | null {
  if (m.days === 0) return `No weather for any day of ${m.month}: no budget.`;
  if (!m.partial) return null;
  const total = m.days + m.missingDates.length;
  return `Partial: the budget covers ${m.days} of ${total} days (no weather for ${m.missingDates.join(', ')}).`;
}
