import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { AlertsService } from '../alerts/domain/alerts-service';
import type { BudgetsService } from '../budgets/domain/budgets-service';
import type { MailQueue } from '../mail/domain/mail-queue';
import type { DailyUseRepository } from '../readings/data/daily-use-repository';
import type { SitesRepository } from '../sites/data/sites-repository';
import type { SitesService } from '../sites/domain/sites-service';
import { reportsRouter } from './api/reports-router';
import { ComplianceNoticesRepository } from './data/compliance-notices-repository';
import { ComplianceNoticeService } from './domain/compliance-notice-service';
import { ComplianceService } from './domain/compliance-service';

export interface Reports {
  compliance: ComplianceService;
  /** /reports/compliance (the worklist: JSON, CSV, PDF), its budget notices and each site's notice history */
  router: Router;
}

/** Wires the compliance ranking of every visible site and the budget notices auditors send. */
export function createReports(deps: {
  db: DataSource;
  sites: SitesService;
  sitesRepository: SitesRepository;
  budgets: BudgetsService;
  dailyUse: DailyUseRepository;
  audit: AuditRepository;
  mailQueue: MailQueue;
  alerts: AlertsService;
  publicUrl: string;
}): Reports {
  const { db, sites, budgets, dailyUse } = deps;
  const noticesRepository = new ComplianceNoticesRepository(db);
  const compliance = new ComplianceService(
    deps.sitesRepository,
    sites,
    budgets,
    dailyUse,
    noticesRepository,
    deps.alerts,
  );
  const notices = new ComplianceNoticeService(
    db,
    sites,
    compliance,
    budgets,
    dailyUse,
    noticesRepository,
    deps.audit,
    deps.mailQueue,
    deps.publicUrl,
  );
  return { compliance, router: Router().use('/reports', reportsRouter(compliance, notices)) };
}
