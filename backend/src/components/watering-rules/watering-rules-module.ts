import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { AlertsService } from '../alerts/domain/alerts-service';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { SitesService } from '../sites/domain/sites-service';
import { wateringRulesRouter } from './api/watering-rules-router';
import { WateringRulesRepository } from './data/watering-rules-repository';
import { WateringRulesService } from './domain/watering-rules-service';

/** Watering rules by stage and the sites under them; the watch checks runs against them. Mounted on /api. */
export function createWateringRules(d: {
  db: DataSource;
  sites: SitesService;
  alerts: AlertsService;
  audit: AuditRepository;
}): { service: WateringRulesService; router: Router } {
  const service = new WateringRulesService(d.db, new WateringRulesRepository(d.db), d.sites, d.alerts, d.audit);
  const router = Router();
  router.use('/watering-rules', wateringRulesRouter(service));
  return { service, router };
}
