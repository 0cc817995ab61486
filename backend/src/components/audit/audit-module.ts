import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { auditRouter } from './api/audit-router';
import { AuditRepository } from './data/audit-repository';

export interface Audit {
  /** Every component records its writes here in the same transaction (the one repository others may use). */
  repository: AuditRepository;
  /** /audit */
  router: Router;
}

/** Wires the audit log. */
export function createAudit(deps: { db: DataSource }): Audit {
  const repository = new AuditRepository(deps.db);
  return { repository, router: Router().use('/audit', auditRouter(repository)) };
}
