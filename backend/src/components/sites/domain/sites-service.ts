import type { DataSource } from 'typeorm';
import type { Page } from '@shared/api/page';
import { atLeast, capabilities, siteLevel, type ShareAccess, type SiteLevel } from '@shared/auth/roles';
import type { SiteDto, SiteInput } from '@shared/sites/site';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import { diff, type AuditRepository } from '../../audit/data/audit-repository';
import type { SiteListFilter, SiteRecord, SitesRepository } from '../data/sites-repository';

/**
 * Sites: who may see and change them. A site the user's organisation can't see is "not found"
 * (so IDs can't be probed); a visible site the role may not change is "forbidden".
 */
export class SitesService {
  constructor(
    private readonly db: DataSource,
    private readonly sites: SitesRepository,
    private readonly audit: AuditRepository,
  ) {}

  async list(principal: Principal, filter: SiteListFilter): Promise<Page<SiteDto>> {
    const { rows, total } = await this.sites.list(principal.organisationId, filter);
    const shares = await this.sites.shares(rows.filter((r) => r.relation.kind === 'owner').map((r) => r.id));
    return {
      items: rows.map((r) => this.toDto(principal, r, shares.get(r.id) ?? [])),
      total,
      page: filter.page,
      pageSize: filter.pageSize,
    };
  }

  async get(principal: Principal, siteId: number): Promise<SiteDto> {
    const record = await this.load(principal, siteId);
    const shares = record.relation.kind === 'owner' ? ((await this.sites.shares([siteId])).get(siteId) ?? []) : [];
    return this.toDto(principal, record, shares);
  }

  /** Every site the organisation owns or is shared, as records with the relation (for other components' rules). */
  async visibleRecords(principal: Principal, filter: { q?: string; tag?: string } = {}): Promise<SiteRecord[]> {
    const { rows } = await this.sites.list(principal.organisationId, {
      page: 0,
      pageSize: 100_000,
      sort: 'name',
      dir: 'asc',
      ...filter,
    });
    return rows;
  }

  tags(principal: Principal): Promise<string[]> {
    return this.sites.tags(principal.organisationId);
  }

  /** For other components (uploads, hydrozones, alerts…): the site if the user has at least `needed` on it. */
  async requireLevel(principal: Principal, siteId: number, needed: SiteLevel): Promise<SiteRecord> {
    const record = await this.load(principal, siteId);
    const level = siteLevel(principal.role, record.relation);
    if (!atLeast(level, needed))
      throw AppError.forbidden(`Your access to this site is "${level}"; this needs "${needed}".`);
    return record;
  }

  /** Every visible site on which the user has at least `needed` (e.g. where an organisation's file may write). */
  async sitesAtLevel(principal: Principal, needed: SiteLevel): Promise<SiteRecord[]> {
    const all = await this.sites.allVisible(principal.organisationId);
    return all.filter((r) => atLeast(siteLevel(principal.role, r.relation), needed));
  }

  async create(principal: Principal, input: SiteInput): Promise<SiteDto> {
    if (!capabilities(principal.role).createSites)
      throw AppError.forbidden('Only administrators and managers can create sites.');
    await this.assertNameFree(principal.organisationId, input.name);
    const id = await this.db.transaction(async (em) => {
      const siteId = await this.sites.insert(em, principal.organisationId, fieldsOf(input), input.tags ?? []);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: principal.organisationId,
        entity: 'site',
        entityId: siteId,
        action: 'create',
        changes: input,
      });
      return siteId;
    });
    return this.get(principal, id);
  }

  async update(principal: Principal, siteId: number, patch: Partial<SiteInput>): Promise<SiteDto> {
    const before = await this.requireLevel(principal, siteId, 'edit');
    if (patch.name !== undefined && patch.name !== before.name)
      await this.assertNameFree(before.organisationId, patch.name, siteId);
    const { tags, ...fields } = patch;
    const changes = diff({ ...before, tags: before.tags }, { ...fields, tags });
    if (Object.keys(changes).length) {
      await this.db.transaction(async (em) => {
        await this.sites.update(em, siteId, fields);
        if (tags) await this.sites.replaceTags(em, siteId, tags);
        await this.audit.record(em, {
          userId: principal.userId,
          organisationId: before.organisationId,
          entity: 'site',
          entityId: siteId,
          action: 'update',
          changes,
        });
      });
    }
    return this.get(principal, siteId);
  }

  async remove(principal: Principal, siteId: number): Promise<void> {
    const before = await this.requireLevel(principal, siteId, 'own');
    await this.db.transaction(async (em) => {
      await this.sites.delete(em, siteId);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: before.organisationId,
        entity: 'site',
        entityId: siteId,
        action: 'delete',
        changes: { name: before.name },
      });
    });
  }

  async share(principal: Principal, siteId: number, organisationId: number, access: ShareAccess): Promise<SiteDto> {
    const site = await this.requireLevel(principal, siteId, 'own');
    if (organisationId === site.organisationId)
      throw AppError.invalid('organisationId', 'a site cannot be shared with its own organisation');
    if (!(await this.sites.organisationExists(organisationId)))
      throw AppError.invalid('organisationId', 'no such organisation');
    await this.db.transaction(async (em) => {
      await this.sites.upsertShare(em, siteId, organisationId, access);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'site',
        entityId: siteId,
        action: 'share',
        changes: { organisationId, access },
      });
    });
    return this.get(principal, siteId);
  }

  async unshare(principal: Principal, siteId: number, organisationId: number): Promise<void> {
    const site = await this.requireLevel(principal, siteId, 'own');
    await this.db.transaction(async (em) => {
      if (!(await this.sites.deleteShare(em, siteId, organisationId))) throw AppError.notFound('Share');
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'site',
        entityId: siteId,
        action: 'unshare',
        changes: { organisationId },
      });
    });
  }

  private async load(principal: Principal, siteId: number): Promise<SiteRecord> {
    const record = await this.sites.findVisible(principal.organisationId, siteId);
    if (!record) throw AppError.notFound('Site');
    return record;
  }

  private async assertNameFree(organisationId: number, name: string, exceptId?: number): Promise<void> {
    if (await this.sites.nameTaken(organisationId, name, exceptId)) {
      throw new AppError('conflict', `A site named "${name}" already exists in this organisation.`, [
        { field: 'name', message: 'is already used by another site' },
      ]);
    }
  }

  private toDto(principal: Principal, r: SiteRecord, shares: SiteDto['shares']): SiteDto {
    return {
      id: r.id,
      name: r.name,
      kind: r.kind,
      address: r.address,
      timeZone: r.timeZone,
      notes: r.notes,
      tags: r.tags,
      organisationId: r.organisationId,
      organisationName: r.organisationName,
      access: siteLevel(principal.role, r.relation),
      shares,
      sharedWithYou:
        r.relation.kind === 'shared' ? { access: r.relation.access, since: r.sharedAt?.toISOString() ?? null } : null,
      createdAt: r.createdAt.toISOString(),
      updatedAt: r.updatedAt.toISOString(),
    };
  }
}

function fieldsOf(input: SiteInput) {
  return {
    name: input.name,
    kind: input.kind,
    address: input.address,
    timeZone: input.timeZone,
    notes: input.notes ?? '',
  };
}
