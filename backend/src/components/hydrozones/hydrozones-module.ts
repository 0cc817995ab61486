import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { SitesService } from '../sites/domain/sites-service';
import { hydrozonesRouter } from './api/hydrozones-router';
import { HydrozonesRepository } from './data/hydrozones-repository';
import { HydrozonesService } from './domain/hydrozones-service';

export interface Hydrozones {
  service: HydrozonesService;
  /** /sites/:id/hydrozones */
  router: Router;
}

/** Wires a site's hydrozones. */
export function createHydrozones(deps: { db: DataSource; sites: SitesService; audit: AuditRepository }): Hydrozones {
  const service = new HydrozonesService(deps.db, new HydrozonesRepository(deps.db), deps.sites, deps.audit);
  return { service, router: Router().use('/sites/:id/hydrozones', hydrozonesRouter(service)) };
}
