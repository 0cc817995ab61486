import type { DataSource } from 'typeorm';
import type { Page } from '@shared/api/page';
import type { BaselineModelForm } from '@shared/savings/baseline-model';
import { savingsProjectPermissions } from '@shared/savings/project-permissions';
import {
  LOCKED_FIELDS,
  type SavingsChangeKind,
  type SavingsHistoryEntryDto,
  type SavingsProjectDto,
  type SavingsProjectInput,
  type SavingsProjectPatch,
  type SavingsProjectPermissions,
} from '@shared/savings/savings-project-dto';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import { diff, type AuditRepository } from '../../audit/data/audit-repository';
import type { SiteRecord } from '../../sites/data/sites-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { SavingsProjectRecord, SavingsProjectsRepository } from '../data/savings-projects-repository';
import { historyEntry } from './savings-history';

/**
 * Savings projects: anyone who can read the site sees them; creating needs `contribute` on the site. Editing follows
 * shared/savings/project-permissions.ts: authors edit their own projects, the owner's managers any project on their
 * sites; the baseline locks when the project is marked installed, and changing it then needs the owner's manager and
 * a reason, kept in the project's audit trail.
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
    return (await this.projects.ofSite(siteId)).map((p) => toDto(p, site, principal));
  }

  /** Projects on the given visible sites; `mine` keeps those written by members of the user's organisation. */
  async ofSites(principal: Principal, sites: SiteRecord[], mine: boolean): Promise<SavingsProjectDto[]> {
    const byId = new Map(sites.map((s) => [s.id, s]));
    const rows = await this.projects.ofSites([...byId.keys()], mine ? principal.organisationId : undefined);
    return rows.map((p) => toDto(p, byId.get(p.siteId)!, principal));
  }

  /** The project and its site, if the user may at least read the site; otherwise 404 as for the site. */
  async load(principal: Principal, id: number): Promise<{ project: SavingsProjectRecord; site: SiteRecord }> {
    const project = await this.projects.find(id);
    if (!project) throw AppError.notFound('Savings project');
    const site = await this.sites.requireLevel(principal, project.siteId, 'read').catch((error: unknown) => {
      // An invisible site hides its projects too.
      if (error instanceof AppError && error.code === 'not_found') throw AppError.notFound('Savings project');
      throw error;
    });
    return { project, site };
  }

  async get(principal: Principal, id: number): Promise<SavingsProjectDto> {
    const { project, site } = await this.load(principal, id);
    return toDto(project, site, principal);
  }

  async create(principal: Principal, siteId: number, input: SavingsProjectInput): Promise<SavingsProjectDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    checkPeriods(input);
    const id = await this.db.transaction(async (em) => {
      const newId = await this.projects.insert(em, siteId, principal.userId, input);
      await this.record(em, principal, site, newId, 'create', { siteId, ...input });
      return newId;
    });
    return this.get(principal, id);
  }

  async update(principal: Principal, id: number, patch: SavingsProjectPatch): Promise<SavingsProjectDto> {
    const { project, site } = await this.load(principal, id);
    const can = this.permissions(principal, project, site);
    const { reason, ...fields } = patch;
    if (!can.edit) throw AppError.forbidden(editRefusal(project));
    const before = toDto(project, site, principal);
    const changes = diff(before as unknown as Record<string, unknown>, fields);
    const lockedChanged = LOCKED_FIELDS.filter((f) => f in changes);
    if (lockedChanged.length && !can.changeBaseline)
      throw AppError.forbidden(
        'The baseline and model are locked since the project was marked installed; ' +
          "only the site owner's managers can change them.",
      );
    if (lockedChanged.length && project.status !== 'planned' && !reason?.trim())
      throw AppError.invalid('reason', 'say why the locked baseline or model changes; it is kept in the audit trail');
    checkPeriods({ ...before, ...fields });
    if (Object.keys(changes).length) {
      const locked = lockedChanged.length > 0 && project.status !== 'planned';
      await this.db.transaction(async (em) => {
        await this.projects.update(em, id, fields);
        await this.record(em, principal, site, id, locked ? 'baseline-change' : 'update', {
          ...changes,
          ...(locked ? { reason: reason!.trim() } : {}),
        });
      });
    }
    return this.get(principal, id);
  }

  /** Locks the installation date, baseline months and model from now on. */
  async markInstalled(principal: Principal, id: number): Promise<SavingsProjectDto> {
    const { project, site } = await this.load(principal, id);
    if (!this.permissions(principal, project, site).markInstalled)
      throw project.status === 'planned'
        ? AppError.forbidden(editRefusal(project))
        : new AppError('conflict', `This project is ${project.status} already.`);
    await this.db.transaction(async (em) => {
      await this.projects.markInstalled(em, id, principal.userId);
      await this.record(em, principal, site, id, 'installed', {
        locked: { installedOn: dateOnly(project.installedOn), baseline: [project.baselineFrom, project.baselineTo] },
      });
    });
    return this.get(principal, id);
  }

  async setArchived(principal: Principal, id: number, archived: boolean): Promise<SavingsProjectDto> {
    const { project, site } = await this.load(principal, id);
    if (!this.permissions(principal, project, site).archive)
      throw AppError.forbidden("Only the site owner's managers and administrators archive savings projects.");
    if ((project.status === 'archived') === archived)
      throw new AppError('conflict', archived ? 'This project is archived already.' : 'This project is not archived.');
    await this.db.transaction(async (em) => {
      await this.projects.setArchived(em, id, archived, principal.userId);
      await this.record(em, principal, site, id, archived ? 'archive' : 'restore', { title: project.title });
    });
    return this.get(principal, id);
  }

  async remove(principal: Principal, id: number): Promise<void> {
    const { project, site } = await this.load(principal, id);
    const can = this.permissions(principal, project, site);
    if (!can.remove)
      throw can.edit || can.archive
        ? new AppError('conflict', 'An installed project is kept: archive it instead of deleting it.')
        : AppError.forbidden(editRefusal(project));
    await this.db.transaction(async (em) => {
      await this.projects.delete(em, id);
      await this.record(em, principal, site, id, 'delete', { title: project.title });
    });
  }

  /** The project's audit trail in plain words, newest first. */
  async history(
    principal: Principal,
    id: number,
    page: { page: number; pageSize: number },
  ): Promise<Page<SavingsHistoryEntryDto>> {
    await this.load(principal, id);
    const trail = await this.audit.trail('savings_project', id, page);
    return { ...trail, items: trail.items.map(historyEntry) };
  }

  private permissions(principal: Principal, p: SavingsProjectRecord, site: SiteRecord): SavingsProjectPermissions {
    return savingsProjectPermissions({
      role: principal.role,
      relation: site.relation,
      userId: principal.userId,
      project: p,
    });
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
      entity: 'savings_project',
      entityId: id,
      action,
      changes,
    });
  }
}

function editRefusal(p: SavingsProjectRecord): string {
  if (p.status === 'archived') return 'This project is archived; restore it first.';
  return (
    `Only ${p.createdByName ?? 'its author'} (who wrote this project) and the site ` + "owner's managers can change it."
  );
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

export function toDto(
  p: SavingsProjectRecord,
  site: Pick<SiteRecord, 'name' | 'organisationName' | 'relation'>,
  principal: Principal,
): SavingsProjectDto {
  return {
    id: p.id,
    siteId: p.siteId,
    siteName: site.name,
    ownerName: site.organisationName,
    title: p.title,
    changeKind: p.changeKind as SavingsChangeKind,
    changeDescription: p.changeDescription,
    retrofits: p.retrofits,
    installedCost: p.installedCost,
    costCurrency: p.costCurrency,
    installedOn: dateOnly(p.installedOn),
    baselineFrom: p.baselineFrom,
    baselineTo: p.baselineTo,
    reportingFrom: p.reportingFrom,
    reportingTo: p.reportingTo,
    modelForm: p.modelForm as BaselineModelForm,
    status: p.status,
    lockedAt: p.lockedAt ? new Date(p.lockedAt).toISOString() : null,
    archivedAt: p.archivedAt ? new Date(p.archivedAt).toISOString() : null,
    createdBy: p.createdBy,
    createdByName: p.createdByName,
    createdByOrganisation: p.createdByOrganisation,
    createdAt: new Date(p.createdAt).toISOString(),
    updatedAt: new Date(p.updatedAt).toISOString(),
    can: savingsProjectPermissions({
      role: principal.role,
      relation: site.relation,
      userId: principal.userId,
      project: p,
    }),
  };
}

function dateOnly(value: string | Date): string {
  return value instanceof Date ? value.toISOString().slice(0, 10) : String(value).slice(0, 10);
}
