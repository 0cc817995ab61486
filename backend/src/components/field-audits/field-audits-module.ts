import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { FileStore } from '../../platform/storage/file-store';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { BudgetsService } from '../budgets/domain/budgets-service';
import type { HydrozonesService } from '../hydrozones/domain/hydrozones-service';
import type { SitesService } from '../sites/domain/sites-service';
import { fieldAuditsRouter, siteFieldAuditsRouter } from './api/field-audits-router';
import { FaultsRepository } from './data/faults-repository';
import { FieldAuditsRepository } from './data/field-audits-repository';
import { ZoneTestsRepository } from './data/zone-tests-repository';
import { FaultsService } from './domain/faults-service';
import { FieldAuditAccess } from './domain/field-audit-access';
import { FieldAuditReport } from './domain/field-audit-report';
import { FieldAuditView } from './domain/field-audit-view';
import { FieldAuditsService } from './domain/field-audits-service';
import { ZoneTestsService } from './domain/zone-tests-service';

export interface FieldAuditsDeps {
  db: DataSource;
  sites: SitesService;
  hydrozones: HydrozonesService;
  budgets: BudgetsService;
  store: FileStore;
  audit: AuditRepository;
}

/** Irrigation field audits: one router mounted on /api. */
export function createFieldAudits(d: FieldAuditsDeps): { audits: FieldAuditsService; router: Router } {
  const auditsRepo = new FieldAuditsRepository(d.db);
  const testsRepo = new ZoneTestsRepository(d.db);
  const faultsRepo = new FaultsRepository(d.db);
  const access = new FieldAuditAccess(auditsRepo, d.sites);
  const view = new FieldAuditView(testsRepo, faultsRepo, d.budgets);
  const audits = new FieldAuditsService(d.db, auditsRepo, testsRepo, access, view, d.sites, d.audit);
  const tests = new ZoneTestsService(d.db, testsRepo, auditsRepo, access, d.hydrozones, audits, d.audit);
  const faults = new FaultsService(d.db, faultsRepo, testsRepo, auditsRepo, access, d.sites, d.store, audits, d.audit);
  const report = new FieldAuditReport(audits, faultsRepo, d.store);
  const router = Router();
  router.use('/sites/:id/field-audits', siteFieldAuditsRouter(audits));
  router.use(fieldAuditsRouter({ audits, tests, faults, report }));
  return { audits, router };
}
