import { atLeast, siteLevel } from '@shared/auth/roles';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { SiteRecord } from '../../sites/data/sites-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { FieldAuditRecord, FieldAuditsRepository } from '../data/field-audits-repository';

export interface AuditAccess {
  audit: FieldAuditRecord;
  site: SiteRecord;
  /** The user's organisation did this audit and the user may write audits on the site. */
  canEdit: boolean;
  /** The user may write results into the site's hydrozones (`contribute`). */
  canApply: boolean;
}

/**
 * Who may do what with audits. Reading needs `read` on the site. Writing audits is field work: contractors (and
 * managers, admins) with `contribute`, and auditors although they are read-only on site data — auditing is
 * their job. An audit belongs to the organisation that did it; only its writers change it. Writing results into
 * hydrozones changes site data, so it needs `contribute` whoever did the audit.
 */
export class FieldAuditAccess {
  constructor(
    private readonly audits: FieldAuditsRepository,
    private readonly sites: SitesService,
  ) {}

  /** The site, if the user may start an audit on it. */
  async siteForNewAudit(principal: Principal, siteId: number): Promise<SiteRecord> {
    const site = await this.sites.requireLevel(principal, siteId, 'read');
    if (!mayWriteAudits(principal, site))
      throw AppError.forbidden('Your access to this site does not allow recording audits.');
    return site;
  }

  async load(principal: Principal, auditId: number, intent: 'read' | 'write' | 'apply'): Promise<AuditAccess> {
    const audit = await this.audits.find(auditId);
    if (!audit) throw AppError.notFound('Field audit');
    const site = await this.sites.requireLevel(principal, audit.siteId, 'read').catch((error: unknown) => {
      // An invisible site hides its audits too.
      if (error instanceof AppError && error.code === 'not_found') throw AppError.notFound('Field audit');
      throw error;
    });
    const canEdit = mayWriteAudits(principal, site) && audit.organisationId === principal.organisationId;
    const canApply = atLeast(siteLevel(principal.role, site.relation), 'contribute');
    if (intent === 'write' && !canEdit)
      throw AppError.forbidden(
        audit.organisationId === principal.organisationId
          ? 'Your access to this site does not allow changing audits.'
          : `This audit belongs to ${audit.organisationName}; only they can change it.`,
      );
    if (intent === 'apply' && !canApply)
      throw AppError.forbidden('Writing audit results into hydrozones needs "contribute" access to the site.');
    return { audit, site, canEdit, canApply };
  }
}

export function mayWriteAudits(principal: Principal, site: SiteRecord): boolean {
  return principal.role === 'auditor' || atLeast(siteLevel(principal.role, site.relation), 'contribute');
}
