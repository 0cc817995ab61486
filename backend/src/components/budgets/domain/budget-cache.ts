import { AppError } from '../../../platform/app-error';
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
      rows = budget.months.map((m) => ({
        siteId,
        month: m.month,
        gallons: m.gallons,
        cost: m.cost?.total ?? null,
        currency: m.cost?.currency ?? null,
        etoMm: m.etoMm,
        rainMm: m.rainMm,
        filledDays: m.filledDays,
        problem: null,
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
        problem: error.message,
      }));
    }
    await this.repo.saveBudgetMonths(rows);
  }
}
