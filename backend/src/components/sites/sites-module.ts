import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { AuditRepository } from '../audit/data/audit-repository';
import { sitesRouter } from './api/sites-router';
import { SitesRepository } from './data/sites-repository';
import { SitesService } from './domain/sites-service';

export interface Sites {
  /** Every component checks access through `requireLevel`. */
  service: SitesService;
  /** Read by the compliance ranking until it has a sites service call of its own. */
  repository: SitesRepository;
  /** /sites */
  router: Router;
}

/** Wires sites, their tags and shares. */
export function createSites(deps: { db: DataSource; audit: AuditRepository }): Sites {
  const repository = new SitesRepository(deps.db);
  const service = new SitesService(deps.db, repository, deps.audit);
  return { service, repository, router: Router().use('/sites', sitesRouter(service)) };
}
