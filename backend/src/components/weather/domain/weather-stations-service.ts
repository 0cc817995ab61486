import type { DataSource } from 'typeorm';
import type { Page } from '@shared/api/page';
import type { WeatherStationSite } from '@shared/weather/daily-eto';
import type {
  MonthlyNormalDto,
  WeatherStationDto,
  WeatherStationInput,
  WeatherStationSort,
} from '@shared/weather/weather-station-dto';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import { diff, type AuditRepository } from '../../audit/data/audit-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { StationRecord, WeatherRepository } from '../data/weather-repository';

/**
 * Weather stations: who may see and change them, and which site takes its weather from which station.
 * Visible: to the owning organisation and to anyone who sees a site linked to the station.
 * Changeable (details, data, normals): the owning organisation's administrators, managers and contractors.
 */
export class WeatherStationsService {
  constructor(
    private readonly db: DataSource,
    private readonly weather: WeatherRepository,
    private readonly sites: SitesService,
    private readonly audit: AuditRepository,
  ) {}

  async list(
    principal: Principal,
    filter: { page: number; pageSize: number; sort: WeatherStationSort; dir: 'asc' | 'desc'; q?: string },
  ): Promise<Page<WeatherStationDto>> {
    const { rows, total } = await this.weather.list(principal.organisationId, filter);
    return { items: rows.map((r) => toDto(principal, r)), total, page: filter.page, pageSize: filter.pageSize };
  }

  async get(principal: Principal, stationId: number): Promise<WeatherStationDto> {
    return toDto(principal, await this.requireVisible(principal, stationId));
  }

  async requireVisible(principal: Principal, stationId: number): Promise<StationRecord> {
    const station = await this.weather.findVisible(principal.organisationId, stationId);
    if (!station) throw AppError.notFound('Weather station');
    return station;
  }

  async requireWritable(principal: Principal, stationId: number): Promise<StationRecord> {
    const station = await this.requireVisible(principal, stationId);
    if (!mayWrite(principal, station))
      throw AppError.forbidden(
        "Only the owning organisation's administrators, managers and contractors can change this station.",
      );
    return station;
  }

  async create(principal: Principal, input: WeatherStationInput): Promise<WeatherStationDto> {
    if (principal.role === 'auditor') throw AppError.forbidden('Auditors cannot create weather stations.');
    await this.assertNameFree(principal.organisationId, input.name);
    const id = await this.db.transaction(async (em) => {
      const stationId = await this.weather.insert(em, principal.organisationId, input);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: principal.organisationId,
        entity: 'weather_station',
        entityId: stationId,
        action: 'create',
        changes: input,
      });
      return stationId;
    });
    return this.get(principal, id);
  }

  async update(
    principal: Principal,
    stationId: number,
    patch: Partial<WeatherStationInput>,
  ): Promise<WeatherStationDto> {
    const before = await this.requireWritable(principal, stationId);
    if (patch.name !== undefined && patch.name !== before.name)
      await this.assertNameFree(before.organisationId, patch.name, stationId);
    const changes = diff(before, patch);
    if (Object.keys(changes).length) {
      await this.db.transaction(async (em) => {
        await this.weather.update(em, stationId, patch);
        await this.audit.record(em, {
          userId: principal.userId,
          organisationId: before.organisationId,
          entity: 'weather_station',
          entityId: stationId,
          action: 'update',
          changes,
        });
      });
    }
    return this.get(principal, stationId);
  }

  async normals(principal: Principal, stationId: number): Promise<MonthlyNormalDto[]> {
    await this.requireVisible(principal, stationId);
    return this.weather.normals(stationId);
  }

  async replaceNormals(
    principal: Principal,
    stationId: number,
    normals: MonthlyNormalDto[],
  ): Promise<MonthlyNormalDto[]> {
    const station = await this.requireWritable(principal, stationId);
    const months = normals.map((n) => n.month).sort((a, b) => a - b);
    if (months.length !== 12 || months.some((m, i) => m !== i + 1)) {
      throw AppError.invalid('normals', 'give exactly one normal for each month 1–12');
    }
    await this.db.transaction(async (em) => {
      await this.weather.replaceNormals(em, stationId, normals);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: station.organisationId,
        entity: 'weather_station',
        entityId: stationId,
        action: 'normals',
        changes: normals,
      });
    });
    return this.weather.normals(stationId);
  }

  /** The station a site takes its weather from, or null. */
  async stationOfSite(principal: Principal, siteId: number): Promise<WeatherStationDto | null> {
    await this.sites.requireLevel(principal, siteId, 'read');
    const stationId = await this.weather.stationIdOfSite(siteId);
    if (stationId === null) return null;
    const station = await this.weather.findVisible(principal.organisationId, stationId);
    return station ? toDto(principal, station) : null;
  }

  /** Links a site to a station the user can see (hydrozone-level technical data: `contribute`). */
  async linkSite(principal: Principal, siteId: number, stationId: number | null): Promise<WeatherStationDto | null> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    if (stationId !== null && !(await this.weather.findVisible(principal.organisationId, stationId))) {
      throw AppError.invalid('stationId', 'no such weather station, or it is not visible to you');
    }
    await this.db.transaction(async (em) => {
      await this.weather.linkSite(em, siteId, stationId);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'site',
        entityId: siteId,
        action: 'weather_station',
        changes: { stationId },
      });
    });
    return this.stationOfSite(principal, siteId);
  }

  private async assertNameFree(organisationId: number, name: string, exceptId?: number): Promise<void> {
    if (await this.weather.nameTaken(organisationId, name, exceptId)) {
      throw new AppError('conflict', `A weather station named "${name}" already exists in this organisation.`, [
        { field: 'name', message: 'is already used by another station' },
      ]);
    }
  }
}

function mayWrite(principal: Principal, station: StationRecord): boolean {
  return station.organisationId === principal.organisationId && principal.role !== 'auditor';
}

/** What the ETo equations need to know about a station. */
export function stationSite(station: StationRecord): WeatherStationSite {
  return {
    latitudeDeg: station.latitude,
    elevationM: station.elevationM,
    windHeightM: station.windHeightM,
    exposure: station.exposure,
  };
}

function toDto(principal: Principal, r: StationRecord): WeatherStationDto {
  return { ...r, canEdit: mayWrite(principal, r) };
}
