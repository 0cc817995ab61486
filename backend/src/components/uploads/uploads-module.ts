import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { Config } from '../../config';
import { fileStoreFromConfig } from '../../platform/storage/file-store-from-config';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { MetersService } from '../meters/domain/meters-service';
import type { DailyUseRepository } from '../readings/data/daily-use-repository';
import type { SitesService } from '../sites/domain/sites-service';
import { importProfilesRouter } from './api/import-profiles-router';
import { uploadsRouter } from './api/uploads-router';
import { UploadsRepository } from './data/uploads-repository';
import { ImportProfilesService } from './domain/import-profiles-service';
import { UploadsService } from './domain/uploads-service';

export interface Uploads {
  service: UploadsService;
  /** /sites/:id/uploads, /uploads/:id (rejections, rollback) and /import-profiles */
  router: Router;
}

/** Wires CSV uploads of meter reads and runtime logs, and the saved column mappings (import profiles). */
export function createUploads(deps: {
  db: DataSource;
  config: Config;
  sites: SitesService;
  meters: MetersService;
  dailyUse: DailyUseRepository;
  audit: AuditRepository;
}): Uploads {
  const { db, config, sites, meters, dailyUse, audit } = deps;
  const repository = new UploadsRepository(db);
  const service = new UploadsService(
    db,
    repository,
    sites,
    meters,
    audit,
    fileStoreFromConfig(config),
    { maxBytes: config.uploads.maxBytes },
    dailyUse,
  );
  const router = Router();
  router.use(uploadsRouter(service, config.uploads.maxBytes));
  router.use(importProfilesRouter(new ImportProfilesService(db, repository, audit)));
  return { service, router };
}
