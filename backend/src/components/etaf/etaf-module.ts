import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { BudgetCache } from '../budgets/domain/budget-cache';
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
}): { service: EtafService; router: Router } {
  const service = new EtafService(d.db, new EtafRepository(d.db), d.sites, d.budgetCache, d.audit);
  const router = Router();
  router.use('/etaf', etafRouter(service));
  router.use('/sites/:id', siteEtafRouter(service));
  return { service, router };
}
