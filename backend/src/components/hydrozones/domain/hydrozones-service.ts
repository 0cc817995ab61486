import type { DataSource } from 'typeorm';
import type { Page } from '@shared/api/page';
import {
  effectiveIrrigationEfficiency,
  effectivePlantFactor,
  validateHydrozone,
  type Hydrozone,
} from '@shared/budgets/hydrozone';
import type { HydrozoneDto, HydrozoneInput, HydrozoneSort } from '@shared/hydrozones/hydrozone-dto';
import { convertArea } from '@shared/units/area-depth-units';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import { diff, type AuditRepository } from '../../audit/data/audit-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { HydrozoneFields, HydrozoneRecord, HydrozonesRepository } from '../data/hydrozones-repository';

/** Hydrozones are technical data: anyone with `read` sees them, `contribute` changes them. */
export class HydrozonesService {
  constructor(
    private readonly db: DataSource,
    private readonly zones: HydrozonesRepository,
    private readonly sites: SitesService,
    private readonly audit: AuditRepository,
  ) {}

  async list(
    principal: Principal,
    siteId: number,
    filter: { page: number; pageSize: number; sort: HydrozoneSort; dir: 'asc' | 'desc'; q?: string },
  ): Promise<Page<HydrozoneDto>> {
    await this.sites.requireLevel(principal, siteId, 'read');
    const { rows, total } = await this.zones.list(siteId, filter);
    return { items: rows.map(toDto), total, page: filter.page, pageSize: filter.pageSize };
  }

  async get(principal: Principal, siteId: number, id: number): Promise<HydrozoneDto> {
    await this.sites.requireLevel(principal, siteId, 'read');
    return toDto(await this.load(siteId, id));
  }

  /** Every hydrozone of a site, for the budget; the caller has checked access. */
  async allOfSite(siteId: number): Promise<HydrozoneRecord[]> {
    return this.zones.all(siteId);
  }

  async load(siteId: number, id: number): Promise<HydrozoneRecord> {
    const zone = await this.zones.find(siteId, id);
    if (!zone) throw AppError.notFound('Hydrozone');
    return zone;
  }

  async create(principal: Principal, siteId: number, input: HydrozoneInput): Promise<HydrozoneDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    const fields = fieldsOf(input);
    checkFields(fields);
    await this.assertNameFree(siteId, fields.name);
    const id = await this.db.transaction(async (em) => {
      const zoneId = await this.zones.insert(em, siteId, fields);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'hydrozone',
        entityId: zoneId,
        action: 'create',
        changes: { siteId, ...fields },
      });
      return zoneId;
    });
    return toDto(await this.load(siteId, id));
  }

  async update(
    principal: Principal,
    siteId: number,
    id: number,
    patch: Partial<HydrozoneInput>,
  ): Promise<HydrozoneDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    const before = await this.load(siteId, id);
    const merged = fieldsOf({
      ...inputOf(before),
      ...patch,
      ...(patch.area !== undefined ? { areaUnit: patch.areaUnit ?? 'ft2' } : { area: before.areaFt2, areaUnit: 'ft2' }),
    });
    checkFields(merged);
    if (merged.name !== before.name) await this.assertNameFree(siteId, merged.name, id);
    const changes = diff(before, merged);
    if (Object.keys(changes).length) {
      await this.db.transaction(async (em) => {
        await this.zones.update(em, id, merged);
        await this.audit.record(em, {
          userId: principal.userId,
          organisationId: site.organisationId,
          entity: 'hydrozone',
          entityId: id,
          action: 'update',
          changes,
        });
      });
    }
    return toDto(await this.load(siteId, id));
  }

  async remove(principal: Principal, siteId: number, id: number): Promise<void> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    const before = await this.load(siteId, id);
    await this.db.transaction(async (em) => {
      await this.zones.delete(em, id);
      // Nothing newer is left to compare with: drop the site's cached monthly budgets outright.
      await em.query('DELETE FROM site_monthly_budget WHERE site_id = ?', [siteId]);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'hydrozone',
        entityId: id,
        action: 'delete',
        changes: { siteId, name: before.name },
      });
    });
  }

  private async assertNameFree(siteId: number, name: string, exceptId?: number): Promise<void> {
    if (await this.zones.nameTaken(siteId, name, exceptId)) {
      throw new AppError('conflict', `A hydrozone named "${name}" already exists on this site.`, [
        { field: 'name', message: 'is already used by another hydrozone of this site' },
      ]);
    }
  }
}

/** The engine's view of a stored hydrozone. */
export function engineZone(r: HydrozoneRecord): Hydrozone {
  return {
    id: String(r.id),
    name: r.name,
    areaFt2: r.areaFt2,
    plantWaterUse: r.plantWaterUse ?? undefined,
    plantFactor: r.plantFactor ?? undefined,
    irrigationMethod: r.irrigationMethod,
    efficiencyOverride: r.efficiencyOverride ?? undefined,
    specialLandscapeArea: r.specialLandscapeArea,
  };
}

function fieldsOf(input: HydrozoneInput): HydrozoneFields {
  const sla = input.specialLandscapeArea ?? false;
  return {
    name: input.name.trim(),
    areaFt2: convertArea(input.area, input.areaUnit, 'ft2'),
    plantWaterUse: input.plantWaterUse ?? null,
    plantFactor: input.plantFactor ?? null,
    irrigationMethod: input.irrigationMethod,
    efficiencyOverride: input.efficiencyOverride ?? null,
    specialLandscapeArea: sla,
    specialLandscapeKind: sla ? (input.specialLandscapeKind ?? null) : null,
    designFlowGpm: input.designFlowGpm ?? null,
    emitterCount: input.emitterCount ?? null,
    emitterGph: input.emitterGph ?? null,
    soilIntakeInPerHour: input.soilIntakeInPerHour ?? null,
    notes: input.notes ?? '',
  };
}

function inputOf(r: HydrozoneRecord): HydrozoneInput {
  return { ...r, area: r.areaFt2, areaUnit: 'ft2' };
}

/** The engine's rules (area > 0, PF 0..1 and within its category, 0 < IE ≤ 1) plus the form-only ones. */
function checkFields(fields: HydrozoneFields): void {
  const details = validateHydrozone(engineZone({ ...fields, id: 0, siteId: 0, updatedAt: new Date() })).map((i) => ({
    field: i.field === 'areaFt2' ? 'area' : i.field,
    message: i.message,
  }));
  if (fields.specialLandscapeArea && !fields.specialLandscapeKind) {
    details.push({
      field: 'specialLandscapeKind',
      message: 'Say why this is a special landscape area (recycled water, edible plants or recreation turf)',
    });
  }
  if ((fields.emitterCount === null) !== (fields.emitterGph === null)) {
    details.push({
      field: fields.emitterCount === null ? 'emitterCount' : 'emitterGph',
      message: 'Give both the emitter count and the flow per emitter (gph), or neither',
    });
  }
  if (details.length)
    throw new AppError(
      'validation_failed',
      `Hydrozone is invalid — ${details.map((d) => `${d.field}: ${d.message}`).join('; ')}`,
      details,
    );
}

function toDto(r: HydrozoneRecord): HydrozoneDto {
  const zone = engineZone(r);
  const efficiency = effectiveIrrigationEfficiency(zone);
  return {
    ...r,
    effectivePlantFactor: effectivePlantFactor(zone),
    effectiveEfficiency: efficiency.efficiency,
    efficiencySource: efficiency.source,
    updatedAt: r.updatedAt.toISOString(),
  };
}
