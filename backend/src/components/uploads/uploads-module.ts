import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { Config } from '../../config';
import { fileStoreFromConfig } from '../../platform/storage/file-store-from-config';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { MetersService } from '../meters/domain/meters-service';
import type { OrganisationSettingsService } from '../organisations/domain/organisation-settings-service';
import type { DailyUseRepository } from '../readings/data/daily-use-repository';
import type { SitesService } from '../sites/domain/sites-service';
import type { DailyWeatherService } from '../weather/domain/daily-weather-service';
import { importProfilesRouter } from './api/import-profiles-router';
import { uploadResultsRouter } from './api/upload-results-router';
import { uploadsRouter } from './api/uploads-router';
import { ConflictsRepository } from './data/conflicts-repository';
import { UploadsRepository } from './data/uploads-repository';
import { ImportProfilesService } from './domain/import-profiles-service';
import { UploadConflictsService } from './domain/upload-conflicts-service';
import { UploadsService } from './domain/uploads-service';

export interface Uploads {
  service: UploadsService;
  /** /sites/:id/uploads, /uploads (an organisation's), /uploads/:id (rejections, conflicts, rollback), profiles */
  router: Router;
}

/** Wires CSV uploads of meter reads, bills and runtime logs, and the saved column mappings (import profiles). */
export function createUploads(deps: {
  db: DataSource;
  config: Config;
  sites: SitesService;
  meters: MetersService;
  organisations: OrganisationSettingsService;
  dailyWeather: DailyWeatherService;
  dailyUse: DailyUseRepository;
  audit: AuditRepository;
}): Uploads {
  const { db, config, dailyUse, audit } = deps;
  const repo = new UploadsRepository(db);
  const service = new UploadsService({
    db,
    repo,
    sites: deps.sites,
    meters: deps.meters,
    organisations: deps.organisations,
    audit,
    store: fileStoreFromConfig(config),
    limits: { maxBytes: config.uploads.maxBytes },
    dailyUse,
    dailyEto: (siteId, from, to) => deps.dailyWeather.siteDailyEto(siteId, from, to),
  });
  const conflicts = new UploadConflictsService({
    db,
    uploads: service,
    repo,
    conflicts: new ConflictsRepository(),
    dailyUse,
    audit,
  });
  const router = Router();
  router.use(uploadsRouter(service, config.uploads.maxBytes));
  router.use(uploadResultsRouter(service, conflicts));
  router.use(importProfilesRouter(new ImportProfilesService(db, repo, audit)));
  return { service, router };
}
