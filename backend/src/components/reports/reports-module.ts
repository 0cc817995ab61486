import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { BudgetsService } from '../budgets/domain/budgets-service';
import type { MailQueue } from '../mail/domain/mail-queue';
import type { RateSchedulesService } from '../rates/domain/rate-schedules-service';
import { DailyUseRepository } from '../readings/data/daily-use-repository';
import { savingsProjectsRouter, siteSavingsProjectsRouter } from '../savings/api/savings-router';
import { SavingsProjectsRepository } from '../savings/data/savings-projects-repository';
import { SavingsProjectsService } from '../savings/domain/savings-projects-service';
import { SavingsReportService } from '../savings/domain/savings-report-service';
import { SitesRepository } from '../sites/data/sites-repository';
import type { SitesService } from '../sites/domain/sites-service';
import type { DailyWeatherService } from '../weather/domain/daily-weather-service';
import type { WeatherStationsService } from '../weather/domain/weather-stations-service';
import { reportsRouter } from './api/reports-router';
import { ComplianceNoticesRepository } from './data/compliance-notices-repository';
import { ComplianceNoticeService } from './domain/compliance-notice-service';
import { ComplianceService } from './domain/compliance-service';

export interface ReportsDeps {
  db: DataSource;
  sites: SitesService;
  budgets: BudgetsService;
  weatherStations: WeatherStationsService;
  dailyWeather: DailyWeatherService;
  rateSchedules: RateSchedulesService;
  audit: AuditRepository;
  mailQueue: MailQueue;
  publicUrl: string;
}

/** Savings projects and reports, the compliance ranking and notices: one router mounted on /api. */
export function createReports(d: ReportsDeps): { router: Router } {
  const dailyUse = new DailyUseRepository(d.db);
  const projects = new SavingsProjectsService(d.db, new SavingsProjectsRepository(d.db), d.sites, d.audit);
  const savingsReports = new SavingsReportService(
    projects,
    d.weatherStations,
    d.dailyWeather,
    dailyUse,
    d.rateSchedules,
  );
  const noticesRepository = new ComplianceNoticesRepository(d.db);
  const compliance = new ComplianceService(new SitesRepository(d.db), d.budgets, dailyUse, noticesRepository);
  const notices = new ComplianceNoticeService(
    d.db,
    d.sites,
    compliance,
    d.budgets,
    dailyUse,
    noticesRepository,
    d.audit,
    d.mailQueue,
    d.publicUrl,
  );
  const router = Router();
  router.use('/sites/:id/savings-projects', siteSavingsProjectsRouter(projects));
  router.use('/savings-projects', savingsProjectsRouter(projects, savingsReports));
  router.use('/reports', reportsRouter(compliance, notices));
  return { router };
}
