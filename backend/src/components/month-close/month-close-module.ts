import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { Config } from '../../config';
import { fileStoreFromConfig } from '../../platform/storage/file-store-from-config';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { AlertsService } from '../alerts/domain/alerts-service';
import type { OrganisationSettingsService } from '../organisations/domain/organisation-settings-service';
import type { ReadingsService } from '../readings/domain/readings-service';
import type { SitesService } from '../sites/domain/sites-service';
import { monthCloseRouter, monthReviewsRouter } from './api/month-close-router';
import { BoardPacketsRepository } from './data/board-packets-repository';
import { MonthReviewsRepository } from './data/month-reviews-repository';
import { BoardPacketService } from './domain/board-packet-service';
import { MonthCloseService } from './domain/month-close-service';

export interface MonthClose {
  service: MonthCloseService;
  packets: BoardPacketService;
  /** /month-close (table, packets) and /sites/:id/month-reviews/:month */
  router: Router;
}

/** Wires the manager's month close: the month's table, review marks and board packets. */
export function createMonthClose(deps: {
  db: DataSource;
  config: Config;
  sites: SitesService;
  readings: ReadingsService;
  alerts: AlertsService;
  organisationSettings: OrganisationSettingsService;
  audit: AuditRepository;
}): MonthClose {
  const { db, sites, readings, alerts, audit } = deps;
  const service = new MonthCloseService(db, sites, readings, alerts, new MonthReviewsRepository(db), audit);
  const packets = new BoardPacketService(
    new BoardPacketsRepository(db),
    service,
    readings,
    alerts,
    deps.organisationSettings,
    fileStoreFromConfig(deps.config),
  );
  const router = Router();
  router.use('/month-close', monthCloseRouter(service, packets));
  router.use('/sites/:id/month-reviews', monthReviewsRouter(service));
  return { service, packets, router };
}
