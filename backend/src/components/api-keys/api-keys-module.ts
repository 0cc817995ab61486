import type { RequestHandler, Router } from 'express';
import type { DataSource } from 'typeorm';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { AuthService } from '../auth/domain/auth-service';
import type { SitesService } from '../sites/domain/sites-service';
import { apiKeyAuth } from './api/api-key-auth';
import { apiKeysRouter } from './api/api-keys-router';
import { ApiKeysRepository } from './data/api-keys-repository';
import { ApiKeysService } from './domain/api-keys-service';

export interface ApiKeys {
  service: ApiKeysService;
  /** Bearer-key authentication; mount before the signed-in check. */
  authenticate: RequestHandler;
  /** /api-keys */
  router: Router;
}

/** Wires the keys machines use to send uploads for chosen sites. */
export function createApiKeys(deps: {
  db: DataSource;
  sites: SitesService;
  auth: AuthService;
  audit: AuditRepository;
}): ApiKeys {
  const service = new ApiKeysService(deps.db, new ApiKeysRepository(deps.db), deps.sites, deps.auth, deps.audit);
  return { service, authenticate: apiKeyAuth(service), router: apiKeysRouter(service) };
}
