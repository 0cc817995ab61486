import { Router, type RequestHandler } from 'express';
import { DailyUseRepository } from '../readings/data/daily-use-repository';
import type { DataSource } from 'typeorm';
import type { Config } from '../../config';
import { LocalFileStore } from '../../platform/storage/local-file-store';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { AuthService } from '../auth/domain/auth-service';
import { apiKeyAuth } from '../api-keys/api/api-key-auth';
import { apiKeysRouter } from '../api-keys/api/api-keys-router';
import { ApiKeysRepository } from '../api-keys/data/api-keys-repository';
import { ApiKeysService } from '../api-keys/domain/api-keys-service';
import { metersRouter } from '../meters/api/meters-router';
import { MetersRepository } from '../meters/data/meters-repository';
import { MetersService } from '../meters/domain/meters-service';
import type { SitesService } from '../sites/domain/sites-service';
import { importProfilesRouter } from './api/import-profiles-router';
import { uploadsRouter } from './api/uploads-router';
import { UploadsRepository } from './data/uploads-repository';
import { ImportProfilesService } from './domain/import-profiles-service';
import { UploadsService } from './domain/uploads-service';

export interface Ingest {
  meters: MetersService;
  uploads: UploadsService;
  apiKeys: ApiKeysService;
  /** Bearer-key authentication; mount before the signed-in check. */
  apiKeyAuth: RequestHandler;
  /** Meters, controllers, uploads, import profiles and API keys, with full paths under /api. */
  router: Router;
}

/** Wires the data-entry components (meters, uploads, API keys), so the app's composition root stays one line each. */
export function createIngest(deps: {
  db: DataSource;
  config: Config;
  sites: SitesService;
  auth: AuthService;
  audit: AuditRepository;
}): Ingest {
  const { db, config, sites, auth, audit } = deps;
  const meters = new MetersService(db, new MetersRepository(db), sites, audit);
  const uploadsRepository = new UploadsRepository(db);
  const uploads = new UploadsService(
    db,
    uploadsRepository,
    sites,
    meters,
    audit,
    new LocalFileStore(config.uploads.dir),
    { maxBytes: config.uploads.maxBytes },
    new DailyUseRepository(db),
  );
  const apiKeys = new ApiKeysService(db, new ApiKeysRepository(db), sites, auth, audit);
  const router = Router();
  router.use(metersRouter(meters));
  router.use(uploadsRouter(uploads, config.uploads.maxBytes));
  router.use(importProfilesRouter(new ImportProfilesService(db, uploadsRepository, audit)));
  router.use(apiKeysRouter(apiKeys));
  return { meters, uploads, apiKeys, apiKeyAuth: apiKeyAuth(apiKeys), router };
}
