import type { DataSource } from 'typeorm';
import type { BudgetsService } from '../budgets/domain/budgets-service';
import { DailyUseRepository } from '../readings/data/daily-use-repository';
import type { RateSchedulesService } from '../rates/domain/rate-schedules-service';
import type { SitesService } from '../sites/domain/sites-service';
import { portfolioRouter, siteDashboardRouter } from './api/portfolio-router';
import { PortfolioRepository } from './data/portfolio-repository';
import { SiteDashboardRepository } from './data/site-dashboard-repository';
import { BudgetCache } from './domain/budget-cache';
import { PortfolioService } from './domain/portfolio-service';
import { SiteDashboardService } from './domain/site-dashboard-service';

/** Wires the dashboard component, so the composition root needs two lines. */
export function createPortfolio(deps: {
  db: DataSource;
  sites: SitesService;
  budgets: BudgetsService;
  rates: RateSchedulesService;
}) {
  const repo = new PortfolioRepository(deps.db);
  const dailyUse = new DailyUseRepository(deps.db);
  const budgetCache = new BudgetCache(repo, deps.budgets);
  const portfolio = new PortfolioService(repo, dailyUse, budgetCache, deps.rates);
  const dashboard = new SiteDashboardService(
    deps.sites,
    new SiteDashboardRepository(deps.db),
    repo,
    dailyUse,
    budgetCache,
    deps.rates,
  );
  return {
    portfolio,
    dashboard,
    budgetCache,
    portfolioRouter: portfolioRouter(portfolio),
    siteDashboardRouter: siteDashboardRouter(dashboard),
  };
}
