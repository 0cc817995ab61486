import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { BudgetCache } from '../portfolio/domain/budget-cache';
import type { SitesService } from '../sites/domain/sites-service';
import { etafRouter, siteEtafRouter } from './api/etaf-router';
import { EtafRepository } from './data/etaf-repository';
import { EtafService } from './domain/etaf-service';

/** Achieved ETAF across the portfolio and the allowed ETAF per site: one router mounted on /api. */
export function createEtaf(d: {
  db: DataSource;
  sites: SitesService;
  budgetCache: BudgetCache;
  audit: AuditRepository;
}): { etaf: EtafService; router: Router } {
  const etaf = new EtafService(d.db, new EtafRepository(d.db), d.sites, d.budgetCache, d.audit);
  const router = Router();
  router.use('/etaf', etafRouter(etaf));
  router.use('/sites/:id', siteEtafRouter(etaf));
  return { etaf, router };
}
