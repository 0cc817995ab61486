import type { DataSource } from 'typeorm';
import type { BaselineModelForm } from '@shared/savings/baseline-model';
import type { SavingsChangeKind, SavingsProjectDto, SavingsProjectInput } from '@shared/savings/savings-project-dto';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import { diff, type AuditRepository } from '../../audit/data/audit-repository';
import type { SiteRecord } from '../../sites/data/sites-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { SavingsProjectRecord, SavingsProjectsRepository } from '../data/savings-projects-repository';

/**
 * Savings projects: anyone who can read the site sees them; writing needs `contribute` (a contractor with a
 * contribute share, the owner's managers and admins), because proving a retrofit is technical work on the site.
 */
export class SavingsProjectsService {
  constructor(
    private readonly db: DataSource,
    private readonly projects: SavingsProjectsRepository,
    private readonly sites: SitesService,
    private readonly audit: AuditRepository,
  ) {}

  async list(principal: Principal, siteId: number): Promise<SavingsProjectDto[]> {
    const site = await this.sites.requireLevel(principal, siteId, 'read');
    return (await this.projects.ofSite(siteId)).map((p) => toDto(p, site));
  }

  /** The project and its site, if the user may at least read the site; otherwise 404 as for the site. */
  async load(
    principal: Principal,
    id: number,
    needed: 'read' | 'contribute' = 'read',
  ): Promise<{ project: SavingsProjectRecord; site: SiteRecord }> {
    const project = await this.projects.find(id);
    if (!project) throw AppError.notFound('Savings project');
    const site = await this.sites.requireLevel(principal, project.siteId, needed).catch((error: unknown) => {
      // An invisible site hides its projects too.
      if (error instanceof AppError && error.code === 'not_found') throw AppError.notFound('Savings project');
      throw error;
    });
    return { project, site };
  }

  async get(principal: Principal, id: number): Promise<SavingsProjectDto> {
    const { project, site } = await this.load(principal, id);
    return toDto(project, site);
  }

  async create(principal: Principal, siteId: number, input: SavingsProjectInput): Promise<SavingsProjectDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    checkPeriods(input);
    const id = await this.db.transaction(async (em) => {
      const newId = await this.projects.insert(em, siteId, principal.userId, input);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'savings_project',
        entityId: newId,
        action: 'create',
        changes: { siteId, ...input },
      });
      return newId;
    });
    return this.get(principal, id);
  }

  async update(principal: Principal, id: number, patch: Partial<SavingsProjectInput>): Promise<SavingsProjectDto> {
    const { project, site } = await this.load(principal, id, 'contribute');
    checkPeriods({ ...toDto(project, site), ...patch });
    const changes = diff(project as unknown as Record<string, unknown>, patch);
    if (Object.keys(changes).length) {
      await this.db.transaction(async (em) => {
        await this.projects.update(em, id, patch);
        await this.audit.record(em, {
          userId: principal.userId,
          organisationId: site.organisationId,
          entity: 'savings_project',
          entityId: id,
          action: 'update',
          changes,
        });
      });
    }
    return this.get(principal, id);
  }

  async remove(principal: Principal, id: number): Promise<void> {
    const { project, site } = await this.load(principal, id, 'contribute');
    await this.db.transaction(async (em) => {
      await this.projects.delete(em, id);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'savings_project',
        entityId: id,
        action: 'delete',
        changes: { title: project.title },
      });
    });
  }
}

function checkPeriods(
  p: Pick<SavingsProjectInput, 'baselineFrom' | 'baselineTo' | 'reportingFrom' | 'reportingTo' | 'installedOn'>,
): void {
  if (p.baselineTo < p.baselineFrom) throw AppError.invalid('baselineTo', 'is before the baseline start');
  if (p.reportingTo < p.reportingFrom) throw AppError.invalid('reportingTo', 'is before the reporting start');
  // The install month itself is neither: the site was half-and-half.
  if (p.baselineTo >= p.installedOn.slice(0, 7))
    throw AppError.invalid('baselineTo', 'must end before the month of installation');
  if (p.reportingFrom <= p.installedOn.slice(0, 7))
    throw AppError.invalid('reportingFrom', 'must start after the month of installation');
}

export function toDto(p: SavingsProjectRecord, site: Pick<SiteRecord, 'name'>): SavingsProjectDto {
  return {
    id: p.id,
    siteId: p.siteId,
    siteName: site.name,
    title: p.title,
    changeKind: p.changeKind as SavingsChangeKind,
    changeDescription: p.changeDescription,
    installedOn: dateOnly(p.installedOn),
    baselineFrom: p.baselineFrom,
    baselineTo: p.baselineTo,
    reportingFrom: p.reportingFrom,
    reportingTo: p.reportingTo,
    modelForm: p.modelForm as BaselineModelForm,
    createdBy: p.createdBy,
    createdAt: new Date(p.createdAt).toISOString(),
    updatedAt: new Date(p.updatedAt).toISOString(),
  };
}

function dateOnly(value: string | Date): string {
  return value instanceof Date ? value.toISOString().slice(0, 10) : String(value).slice(0, 10);
}
