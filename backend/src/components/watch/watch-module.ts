import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { Config } from '../../config';
import { JobLease } from '../../jobs/job-lease';
import { alertsRouter, notificationsRouter } from '../alerts/api/alerts-router';
import { AlertsRepository } from '../alerts/data/alerts-repository';
import { AlertNotifier } from '../alerts/domain/alert-notifier';
import { AlertsService } from '../alerts/domain/alerts-service';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { BudgetsService } from '../budgets/domain/budgets-service';
import type { MailQueue } from '../mail/domain/mail-queue';
import type { RateSchedulesService } from '../rates/domain/rate-schedules-service';
import type { SitesService } from '../sites/domain/sites-service';
import { watchRouter, watchSettingsRouter } from './api/watch-router';
import { WatchDataRepository } from './data/watch-data-repository';
import { WatchRunsRepository } from './data/watch-runs-repository';
import { SiteWatchInputLoader } from './domain/site-watch-input';
import { WatchService } from './domain/watch-service';
import { WatchSettingsService } from './domain/watch-settings-service';

export interface Watch {
  service: WatchService;
  alerts: AlertsService;
  /** The watch's scheduled job: hourly, checking the sites whose local night hour has passed. */
  job: { name: string; cron: string; run: () => Promise<unknown> };
  /** /alerts, /watch, /sites/:id/watch-settings and /me/notifications, with full paths under /api. */
  router: Router;
}

export const WATCH_LEASE_NAME = 'nightly-watch';

/** Wires the nightly watch and the alerts it files, so the composition root adds one line. */
export function createWatch(deps: {
  db: DataSource;
  config: Config;
  sites: SitesService;
  budgets: BudgetsService;
  rates: RateSchedulesService;
  mailQueue: MailQueue;
  audit: AuditRepository;
}): Watch {
  const { db, config, sites, budgets, rates, mailQueue, audit } = deps;
  const data = new WatchDataRepository(db);
  const alertsRepository = new AlertsRepository(db);
  const runs = new WatchRunsRepository(db);
  const notifier = new AlertNotifier(db, mailQueue, config.http.publicUrl);
  const service = new WatchService(
    db,
    data,
    new SiteWatchInputLoader(data, budgets, rates),
    alertsRepository,
    runs,
    notifier,
    new JobLease(db, WATCH_LEASE_NAME),
    config.watch.localHour,
  );
  const alerts = new AlertsService(db, alertsRepository, sites, audit);
  const router = Router();
  router.use('/alerts', alertsRouter(alerts));
  router.use('/watch', watchRouter(service, runs));
  router.use('/sites/:id/watch-settings', watchSettingsRouter(new WatchSettingsService(db, data, sites, audit)));
  router.use('/me/notifications', notificationsRouter(alerts));
  return {
    service,
    alerts,
    job: {
      name: 'nightly-watch',
      cron: config.watch.cron,
      run: () => service.run({ trigger: 'scheduled', organisationId: null, requestedBy: null }),
    },
    router,
  };
}
