import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { RateSchedulesService } from '../rates/domain/rate-schedules-service';
import type { DailyUseRepository } from '../readings/data/daily-use-repository';
import type { SitesService } from '../sites/domain/sites-service';
import type { DailyWeatherService } from '../weather/domain/daily-weather-service';
import type { WeatherStationsService } from '../weather/domain/weather-stations-service';
import { savingsProjectsRouter, siteSavingsProjectsRouter } from './api/savings-router';
import { SavingsProjectsRepository } from './data/savings-projects-repository';
import { SavingsProjectsService } from './domain/savings-projects-service';
import { SavingsReportService } from './domain/savings-report-service';
import { SavingsBookService } from './domain/savings-book-service';
import { SavingsHandoutService } from './domain/savings-handout-service';
import type { OrganisationSettingsService } from '../organisations/domain/organisation-settings-service';

export interface Savings {
  projects: SavingsProjectsService;
  /** /sites/:id/savings-projects and /savings-projects (the book; each project's report, CSV, PDF and handout) */
  router: Router;
}

/** Wires savings projects and their reports (baseline fit against weather, savings against ASHRAE Guideline 14). */
export function createSavings(deps: {
  db: DataSource;
  sites: SitesService;
  weatherStations: WeatherStationsService;
  dailyWeather: DailyWeatherService;
  dailyUse: DailyUseRepository;
  rates: RateSchedulesService;
  organisationSettings: OrganisationSettingsService;
  audit: AuditRepository;
}): Savings {
  const { db, sites, audit } = deps;
  const projects = new SavingsProjectsService(db, new SavingsProjectsRepository(db), sites, audit);
  const reports = new SavingsReportService(
    projects,
    deps.weatherStations,
    deps.dailyWeather,
    deps.dailyUse,
    deps.rates,
  );
  const router = Router();
  router.use('/sites/:id/savings-projects', siteSavingsProjectsRouter(projects));
  const book = new SavingsBookService(sites, projects, reports);
  const handouts = new SavingsHandoutService(reports, deps.organisationSettings);
  router.use('/savings-projects', savingsProjectsRouter({ projects, reports, book, handouts }));
  return { projects, router };
}
