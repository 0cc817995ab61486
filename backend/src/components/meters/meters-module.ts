import type { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { SitesService } from '../sites/domain/sites-service';
import { metersRouter } from './api/meters-router';
import { MetersRepository } from './data/meters-repository';
import { MetersService } from './domain/meters-service';

export interface Meters {
  service: MetersService;
  /** /sites/:id/meters, /sites/:id/controllers and their zones */
  router: Router;
}

/** Wires a site's meters, controllers and controller zones. */
export function createMeters(deps: { db: DataSource; sites: SitesService; audit: AuditRepository }): Meters {
  const service = new MetersService(deps.db, new MetersRepository(deps.db), deps.sites, deps.audit);
  return { service, router: metersRouter(service) };
}
