import type { DataSource } from 'typeorm';
import type { Page } from '@shared/api/page';
import { atLeast, siteLevel } from '@shared/auth/roles';
import type { PlanDto, PlanInput } from '@shared/planner/plan-dto';
import { checkZoneChanges } from '@shared/planner/plan-zones';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import { diff, type AuditRepository } from '../../audit/data/audit-repository';
import type { SiteRecord } from '../../sites/data/sites-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { PlanListFilter, PlanRecord, PlansRepository } from '../data/plans-repository';
import type { PlanZones } from './plan-zones-source';

const PLANNER_ROLES = new Set(['admin', 'manager', 'contractor']);

/**
 * What-if plans are the owner's and its contractors' deliberations (costs, options): managers, admins and
 * contractors read them with `read` on the site and write them with `contribute`; auditors do not see them.
 */
export class PlansService {
  constructor(
    private readonly db: DataSource,
    private readonly plans: PlansRepository,
    private readonly sites: SitesService,
    private readonly zones: PlanZones,
    private readonly audit: AuditRepository,
  ) {}

  async site(principal: Principal, siteId: number, needed: 'read' | 'contribute'): Promise<SiteRecord> {
    if (!PLANNER_ROLES.has(principal.role))
      throw AppError.forbidden('What-if plans are for managers, administrators and contractors.');
    return this.sites.requireLevel(principal, siteId, needed);
  }

  /** The plan and its site; 404 as for the site when the site is invisible. */
  async load(
    principal: Principal,
    id: number,
    needed: 'read' | 'contribute' = 'read',
  ): Promise<{ plan: PlanRecord; site: SiteRecord }> {
    const plan = await this.plans.find(id);
    if (!plan) throw AppError.notFound('Plan');
    const site = await this.site(principal, plan.siteId, needed).catch((error: unknown) => {
      if (error instanceof AppError && error.code === 'not_found') throw AppError.notFound('Plan');
      throw error;
    });
    return { plan, site };
  }

  async list(principal: Principal, siteId: number, filter: PlanListFilter): Promise<Page<PlanDto>> {
    const site = await this.site(principal, siteId, 'read');
    const { rows, total } = await this.plans.list(siteId, filter);
    return { items: rows.map((p) => toDto(p, site, principal)), total, page: filter.page, pageSize: filter.pageSize };
  }

  async get(principal: Principal, id: number): Promise<PlanDto> {
    const { plan, site } = await this.load(principal, id);
    return toDto(plan, site, principal);
  }

  async create(principal: Principal, siteId: number, input: PlanInput): Promise<PlanDto> {
    const site = await this.site(principal, siteId, 'contribute');
    await this.checkChanges(siteId, input);
    const id = await this.db.transaction(async (em) => {
      const newId = await this.plans.insert(em, siteId, principal.userId, input);
      await this.record(em, principal, site, newId, 'create', { siteId, ...input });
      return newId;
    });
    return this.get(principal, id);
  }

  async update(principal: Principal, id: number, patch: Partial<PlanInput>): Promise<PlanDto> {
    const { plan, site } = await this.load(principal, id, 'contribute');
    if (plan.status === 'carried-out')
      throw new AppError('conflict', 'This plan has been carried out; copy it into a new plan to change it.');
    if (patch.zoneChanges) await this.checkChanges(plan.siteId, { zoneChanges: patch.zoneChanges });
    const changes = diff(plan as unknown as Record<string, unknown>, patch);
    if (Object.keys(changes).length)
      await this.db.transaction(async (em) => {
        await this.plans.update(em, id, patch);
        await this.record(em, principal, site, id, 'update', changes);
      });
    return this.get(principal, id);
  }

  async remove(principal: Principal, id: number): Promise<void> {
    const { plan, site } = await this.load(principal, id, 'contribute');
    await this.db.transaction(async (em) => {
      await this.plans.delete(em, id);
      await this.record(em, principal, site, id, 'delete', { title: plan.title });
    });
  }

  private async checkChanges(siteId: number, input: Pick<PlanInput, 'zoneChanges'>): Promise<void> {
    const problems = checkZoneChanges(await this.zones.ofSite(siteId), input.zoneChanges);
    if (problems.length)
      throw new AppError(
        'validation_failed',
        `Plan is invalid — ${problems.join('; ')}`,
        problems.map((message) => ({ field: 'zoneChanges', message })),
      );
  }

  private record(
    em: Parameters<AuditRepository['record']>[0],
    principal: Principal,
    site: SiteRecord,
    id: number,
    action: string,
    changes: unknown,
  ): Promise<void> {
    return this.audit.record(em, {
      userId: principal.userId,
      organisationId: site.organisationId,
      entity: 'what_if_plan',
      entityId: id,
      action,
      changes,
    });
  }
}

export function toDto(p: PlanRecord, site: SiteRecord, principal: Principal): PlanDto {
  return {
    id: p.id,
    siteId: p.siteId,
    siteName: site.name,
    title: p.title,
    notes: p.notes,
    weatherYear: p.weatherYear,
    costOfWork: p.costOfWork,
    currency: p.currency,
    smartControllerReductionPercent: p.smartControllerReductionPercent,
    rainSensor: p.rainSensor,
    zoneChanges: p.zoneChanges,
    status: p.status,
    savingsProjectId: p.savingsProjectId,
    carriedOutOn: p.carriedOutOn,
    canEdit: p.status === 'draft' && atLeast(siteLevel(principal.role, site.relation), 'contribute'),
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
  };
}
