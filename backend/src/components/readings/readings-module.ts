import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { AlertsService } from '../alerts/domain/alerts-service';
import type { BudgetCache } from '../budgets/domain/budget-cache';
import type { RateSchedulesService } from '../rates/domain/rate-schedules-service';
import type { SitesService } from '../sites/domain/sites-service';
import { readingsRouter } from './api/readings-router';
import { DailyUseRepository } from './data/daily-use-repository';
import { ReadingsRepository } from './data/readings-repository';
import { ReadingsService } from './domain/readings-service';

export interface Readings {
  service: ReadingsService;
  /**
   * The daily and monthly use rollups. Uploads refresh them inside their transactions and the portfolio,
   * savings and compliance reports read them, until readings offers those as service calls.
   */
  dailyUse: DailyUseRepository;
  /** /sites/:id/overview, /hourly-grid and /monthly */
  router: Router;
}

/** Wires a site's readings: the rollups and the series the site pages show. */
export function createReadings(deps: {
  db: DataSource;
  sites: SitesService;
  budgetCache: BudgetCache;
  rates: RateSchedulesService;
  alerts: AlertsService;
}): Readings {
  const dailyUse = new DailyUseRepository(deps.db);
  const service = new ReadingsService(
    deps.sites,
    new ReadingsRepository(deps.db),
    dailyUse,
    deps.budgetCache,
    deps.rates,
    deps.alerts,
  );
  return { service, dailyUse, router: Router().use('/sites/:id', readingsRouter(service)) };
}
