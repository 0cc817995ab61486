import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { Config } from '../../config';
import { JobLease } from '../../jobs/job-lease';
import type { Alerts } from '../alerts/alerts-module';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { BudgetsService } from '../budgets/domain/budgets-service';
import type { RateSchedulesService } from '../rates/domain/rate-schedules-service';
import type { SitesService } from '../sites/domain/sites-service';
import type { DailyWeatherService } from '../weather/domain/daily-weather-service';
import type { WateringRulesService } from '../watering-rules/domain/watering-rules-service';
import { watchRouter, watchSettingsRouter } from './api/watch-router';
import { WatchDataRepository } from './data/watch-data-repository';
import { WatchRunsRepository } from './data/watch-runs-repository';
import { SiteWatchInputLoader } from './domain/site-watch-input';
import { StationHealth } from './domain/station-health';
import { WatchService } from './domain/watch-service';
import { WatchSettingsService } from './domain/watch-settings-service';

export interface Watch {
  service: WatchService;
  /** The watch's scheduled job: hourly, checking the sites whose local night hour has passed. */
  job: { name: string; cron: string; run: () => Promise<unknown> };
  /** /watch and /sites/:id/watch-settings */
  router: Router;
}

export const WATCH_LEASE_NAME = 'nightly-watch';

/** Wires the nightly watch: which sites to check, the detectors' input, the runs and a site's watch settings. */
export function createWatch(deps: {
  db: DataSource;
  config: Config;
  sites: SitesService;
  budgets: BudgetsService;
  rates: RateSchedulesService;
  alerts: Alerts;
  audit: AuditRepository;
  dailyWeather: DailyWeatherService;
  wateringRules: WateringRulesService;
}): Watch {
  const { db, config, sites, budgets, rates, alerts, audit, dailyWeather, wateringRules } = deps;
  const data = new WatchDataRepository(db);
  const runs = new WatchRunsRepository(db);
  const service = new WatchService({
    db,
    data,
    inputs: new SiteWatchInputLoader(data, budgets, rates, wateringRules),
    alerts: alerts.repository,
    repairs: alerts.repairs,
    repairNotifier: alerts.repairNotifier,
    runs,
    notifier: alerts.notifier,
    stations: new StationHealth(dailyWeather),
    lease: new JobLease(db, WATCH_LEASE_NAME),
    localHour: config.watch.localHour,
  });
  const router = Router();
  router.use('/watch', watchRouter(service, runs));
  router.use('/sites/:id/watch-settings', watchSettingsRouter(new WatchSettingsService(db, data, sites, audit)));
  return {
    service,
    job: {
      name: 'nightly-watch',
      cron: config.watch.cron,
      run: () => service.run({ trigger: 'scheduled', organisationId: null, requestedBy: null }),
    },
    router,
  };
}
