import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { SitesService } from '../sites/domain/sites-service';
import { rateSchedulesRouter } from './api/rate-schedules-router';
import { RateSchedulesRepository } from './data/rate-schedules-repository';
import { RateSchedulesService } from './domain/rate-schedules-service';

export interface Rates {
  service: RateSchedulesService;
  /** /sites/:id/rate-schedules */
  router: Router;
}

/** Wires a site's water rate schedules. */
export function createRates(deps: { db: DataSource; sites: SitesService; audit: AuditRepository }): Rates {
  const service = new RateSchedulesService(deps.db, new RateSchedulesRepository(deps.db), deps.sites, deps.audit);
  return { service, router: Router().use('/sites/:id/rate-schedules', rateSchedulesRouter(service)) };
}
