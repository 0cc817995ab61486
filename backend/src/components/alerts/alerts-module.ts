import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { Config } from '../../config';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { MailQueue } from '../mail/domain/mail-queue';
import type { SitesService } from '../sites/domain/sites-service';
import { alertsRouter, notificationsRouter } from './api/alerts-router';
import { AlertFiguresRepository } from './data/alert-figures-repository';
import { AlertMailRepository } from './data/alert-mail-repository';
import { AlertRepairsRepository } from './data/alert-repairs-repository';
import { AlertsRepository } from './data/alerts-repository';
import { AlertNotifier } from './domain/alert-notifier';
import { AlertsService } from './domain/alerts-service';
import { RepairNotifier } from './domain/repair-notifier';

export interface Alerts {
  service: AlertsService;
  /** Files the watch's findings; the watch writes through it until alerts has a filing service call. */
  repository: AlertsRepository;
  /** Repairs being checked and the data's verdicts on them; the watch writes through it as it files findings. */
  repairs: AlertRepairsRepository;
  /** Queues alert e-mail (each alert or a nightly digest, as each user chose). */
  notifier: AlertNotifier;
  /** Mails whoever resolved an alert as fixed when the data does not confirm the repair. */
  repairNotifier: RepairNotifier;
  /** /alerts and /me/notifications */
  router: Router;
}

/** Wires stored alerts, their inbox and the e-mail about them. */
export function createAlerts(deps: {
  db: DataSource;
  config: Config;
  sites: SitesService;
  mailQueue: MailQueue;
  audit: AuditRepository;
}): Alerts {
  const { db, config, sites, mailQueue, audit } = deps;
  const repository = new AlertsRepository(db);
  const mail = new AlertMailRepository(db);
  const repairs = new AlertRepairsRepository(db);
  const service = new AlertsService(db, repository, sites, audit, new AlertFiguresRepository(db), mail, repairs);
  const notifier = new AlertNotifier(db, mail, mailQueue, config.http.publicUrl);
  const router = Router();
  router.use('/alerts', alertsRouter(service));
  router.use('/me/notifications', notificationsRouter(service));
  const repairNotifier = new RepairNotifier(db, repairs, mailQueue, config.http.publicUrl);
  return { service, repository, repairs, notifier, repairNotifier, router };
}
