import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { AlertsService } from '../alerts/domain/alerts-service';
import type { BudgetCache } from '../budgets/domain/budget-cache';
import type { RateSchedulesService } from '../rates/domain/rate-schedules-service';
import type { DailyUseRepository } from '../readings/data/daily-use-repository';
import { portfolioRouter } from './api/portfolio-router';
import { PortfolioRepository } from './data/portfolio-repository';
import { PortfolioService } from './domain/portfolio-service';

export interface Portfolio {
  service: PortfolioService;
  /** /portfolio */
  router: Router;
}

/** Wires the portfolio: every visible site's use against budget over a period. */
export function createPortfolio(deps: {
  db: DataSource;
  dailyUse: DailyUseRepository;
  budgetCache: BudgetCache;
  rates: RateSchedulesService;
  alerts: AlertsService;
}): Portfolio {
  const service = new PortfolioService(
    new PortfolioRepository(deps.db),
    deps.dailyUse,
    deps.budgetCache,
    deps.rates,
    deps.alerts,
  );
  return { service, router: Router().use('/portfolio', portfolioRouter(service)) };
}
