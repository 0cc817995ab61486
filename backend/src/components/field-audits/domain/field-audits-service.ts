import type { DataSource } from 'typeorm';
import type { Page } from '@shared/api/page';
import type { FieldAuditDto, FieldAuditInput, FieldAuditSummaryDto } from '@shared/field-audits/field-audit-dto';
import type { Principal } from '../../../platform/auth/principal';
import { diff, type AuditRepository } from '../../audit/data/audit-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { FieldAuditListFilter, FieldAuditsRepository } from '../data/field-audits-repository';
import type { ZoneTestsRepository } from '../data/zone-tests-repository';
import { mayWriteAudits, type FieldAuditAccess } from './field-audit-access';
import type { FieldAuditView } from './field-audit-view';

/** Audits of a site: list, read, start, change, delete. Tests and faults have their own services. */
export class FieldAuditsService {
  constructor(
    private readonly db: DataSource,
    private readonly audits: FieldAuditsRepository,
    private readonly tests: ZoneTestsRepository,
    private readonly access: FieldAuditAccess,
    private readonly view: FieldAuditView,
    private readonly sites: SitesService,
    private readonly log: AuditRepository,
  ) {}

  async list(principal: Principal, siteId: number, filter: FieldAuditListFilter): Promise<Page<FieldAuditSummaryDto>> {
    const site = await this.sites.requireLevel(principal, siteId, 'read');
    const { rows, total } = await this.audits.list(siteId, filter);
    const tests = await this.tests.ofAudits(rows.map((r) => r.id));
    const writer = mayWriteAudits(principal, site);
    return {
      items: rows.map((a) =>
        this.view.summary(
          a,
          site.name,
          writer && a.organisationId === principal.organisationId,
          tests.filter((t) => t.auditId === a.id),
        ),
      ),
      total,
      page: filter.page,
      pageSize: filter.pageSize,
    };
  }

  async get(principal: Principal, id: number): Promise<FieldAuditDto> {
    return this.view.full(principal, await this.access.load(principal, id, 'read'));
  }

  async create(principal: Principal, siteId: number, input: FieldAuditInput): Promise<FieldAuditDto> {
    const site = await this.access.siteForNewAudit(principal, siteId);
    const id = await this.db.transaction(async (em) => {
      const newId = await this.audits.insert(
        em,
        { siteId, organisationId: principal.organisationId, createdBy: principal.userId },
        input,
      );
      await this.log.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'field_audit',
        entityId: newId,
        action: 'create',
        changes: { siteId, ...input },
      });
      return newId;
    });
    return this.get(principal, id);
  }

  async update(principal: Principal, id: number, patch: Partial<FieldAuditInput>): Promise<FieldAuditDto> {
    const { audit, site } = await this.access.load(principal, id, 'write');
    const changes = diff(audit as unknown as Record<string, unknown>, patch);
    if (Object.keys(changes).length) {
      await this.db.transaction(async (em) => {
        await this.audits.update(em, id, patch);
        await this.log.record(em, {
          userId: principal.userId,
          organisationId: site.organisationId,
          entity: 'field_audit',
          entityId: id,
          action: 'update',
          changes,
        });
      });
    }
    return this.get(principal, id);
  }

  async remove(principal: Principal, id: number): Promise<void> {
    const { audit, site } = await this.access.load(principal, id, 'write');
    await this.db.transaction(async (em) => {
      await this.audits.delete(em, id);
      await this.log.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'field_audit',
        entityId: id,
        action: 'delete',
        changes: { title: audit.title, siteId: audit.siteId },
      });
    });
  }
}
