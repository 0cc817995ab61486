import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { HydrozonesService } from '../hydrozones/domain/hydrozones-service';
import type { OrganisationSettingsService } from '../organisations/domain/organisation-settings-service';
import type { RateSchedulesService } from '../rates/domain/rate-schedules-service';
import type { SitesService } from '../sites/domain/sites-service';
import type { DailyWeatherService } from '../weather/domain/daily-weather-service';
import type { WeatherStationsService } from '../weather/domain/weather-stations-service';
import { budgetsRouter } from './api/budgets-router';
import { BudgetCacheRepository } from './data/budget-cache-repository';
import { BudgetCache } from './domain/budget-cache';
import { BudgetsService } from './domain/budgets-service';

export interface Budgets {
  service: BudgetsService;
  /** Monthly budgets kept in `site_monthly_budget` for the portfolio and the site pages. */
  cache: BudgetCache;
  /** /sites/:id/budget, /compliance and /hydrozones/:zoneId/advice */
  router: Router;
}

/** Wires the water budget (computed from hydrozones, weather and rates) and its monthly cache. */
export function createBudgets(deps: {
  db: DataSource;
  sites: SitesService;
  hydrozones: HydrozonesService;
  weatherStations: WeatherStationsService;
  dailyWeather: DailyWeatherService;
  rates: RateSchedulesService;
  organisationSettings: OrganisationSettingsService;
}): Budgets {
  const service = new BudgetsService(
    deps.sites,
    deps.hydrozones,
    deps.weatherStations,
    deps.dailyWeather,
    deps.rates,
    deps.organisationSettings,
  );
  const cache = new BudgetCache(new BudgetCacheRepository(deps.db), service);
  return { service, cache, router: Router().use('/sites/:id', budgetsRouter(service)) };
}
