import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { AuditRepository } from '../audit/data/audit-repository';
import { organisationRouter } from './api/organisation-router';
import { OrganisationsRepository } from './data/organisations-repository';
import { OrganisationSettingsService } from './domain/organisation-settings-service';

export interface Organisations {
  settings: OrganisationSettingsService;
  /** /organisation */
  router: Router;
}

/** Wires the signed-in organisation's settings. */
export function createOrganisations(deps: { db: DataSource; audit: AuditRepository }): Organisations {
  const settings = new OrganisationSettingsService(deps.db, new OrganisationsRepository(deps.db), deps.audit);
  return { settings, router: Router().use('/organisation', organisationRouter(settings)) };
}
