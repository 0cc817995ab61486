import type { DataSource, EntityManager, SelectQueryBuilder } from 'typeorm';
import type {
  DailyWeatherMethod,
  MonthlyNormalDto,
  StationExposure,
  StationSourceKind,
  WeatherStationSort,
} from '@shared/weather/weather-station-dto';
import { OrganisationEntity } from '../../organisations/data/organisation.entity';
import { SiteEntity } from '../../sites/data/site.entity';
import { escapeLike } from '../../users/data/users-repository';
import { DailyWeatherEntity } from './daily-weather.entity';
import { MonthlyWeatherNormalEntity } from './monthly-weather-normal.entity';
import { WeatherStationEntity } from './weather-station.entity';

export interface StationRecord {
  id: number;
  organisationId: number;
  organisationName: string;
  name: string;
  latitude: number;
  longitude: number;
  elevationM: number;
  windHeightM: number;
  exposure: StationExposure;
  sourceKind: StationSourceKind;
  dayCount: number;
  firstDate: string | null;
  lastDate: string | null;
}

export type StationFields = Omit<
  StationRecord,
  'id' | 'organisationId' | 'organisationName' | 'dayCount' | 'firstDate' | 'lastDate'
>;

export interface DailyRecord {
  date: string;
  etoMm: number | null;
  rainMm: number | null;
  method: DailyWeatherMethod;
  source: 'upload' | 'feed';
}

export interface DayToStore extends DailyRecord {
  observations: string | null;
}

const SORT_COLUMNS: Record<WeatherStationSort, string> = {
  name: 'ws.name',
  organisationName: 'o.name',
  lastDate: 'lastDate',
};

/**
 * Stations, their daily weather and normals. A station is visible to an organisation that owns it or that sees
 * a site linked to it. The site → station link column lives on `site` but belongs to this feature.
 */
export class WeatherRepository {
  constructor(private readonly db: DataSource) {}

  private visible(organisationId: number): SelectQueryBuilder<WeatherStationEntity> {
    return this.db
      .getRepository(WeatherStationEntity)
      .createQueryBuilder('ws')
      .innerJoin(OrganisationEntity, 'o', 'o.id = ws.organisation_id')
      .where(
        `(ws.organisation_id = :viewer OR EXISTS (SELECT 1 FROM site s LEFT JOIN site_share sh ON
          sh.site_id = s.id AND sh.organisation_id = :viewer
          WHERE s.weather_station_id = ws.id AND (s.organisation_id = :viewer OR sh.organisation_id
          IS NOT NULL)))`,
        { viewer: organisationId },
      );
  }

  private withColumns(qb: SelectQueryBuilder<WeatherStationEntity>): SelectQueryBuilder<WeatherStationEntity> {
    return qb.select([
      'ws.id AS id',
      'ws.organisation_id AS organisationId',
      'o.name AS organisationName',
      'ws.name AS name',
      'ws.latitude AS latitude',
      'ws.longitude AS longitude',
      'ws.elevation_m AS elevationM',
      'ws.wind_height_m AS windHeightM',
      'ws.exposure AS exposure',
      'ws.source_kind AS sourceKind',
      '(SELECT COUNT(*) FROM daily_weather d WHERE d.station_id = ws.id) AS dayCount',
      '(SELECT MIN(d.date) FROM daily_weather d WHERE d.station_id = ws.id) AS firstDate',
      '(SELECT MAX(d.date) FROM daily_weather d WHERE d.station_id = ws.id) AS lastDate',
    ]);
  }

  async list(
    organisationId: number,
    f: { page: number; pageSize: number; sort: WeatherStationSort; dir: 'asc' | 'desc'; q?: string },
  ) {
    const qb = this.visible(organisationId);
    if (f.q) qb.andWhere('ws.name LIKE :q', { q: `%${escapeLike(f.q)}%` });
    const total = await qb.getCount();
    const raw = await this.withColumns(qb)
      .orderBy(SORT_COLUMNS[f.sort], f.dir === 'asc' ? 'ASC' : 'DESC')
      .addOrderBy('ws.id', 'ASC')
      .offset(f.page * f.pageSize)
      .limit(f.pageSize)
      .getRawMany();
    return { rows: raw.map(toRecord), total };
  }

  async findVisible(organisationId: number, stationId: number): Promise<StationRecord | null> {
    const raw = await this.withColumns(
      this.visible(organisationId).andWhere('ws.id = :stationId', { stationId }),
    ).getRawOne();
    return raw ? toRecord(raw) : null;
  }

  async nameTaken(organisationId: number, name: string, exceptId?: number): Promise<boolean> {
    const qb = this.db
      .getRepository(WeatherStationEntity)
      .createQueryBuilder('ws')
      .where('ws.organisation_id = :organisationId AND ws.name = :name', { organisationId, name });
    if (exceptId) qb.andWhere('ws.id <> :exceptId', { exceptId });
    return (await qb.getCount()) > 0;
  }

  async insert(em: EntityManager, organisationId: number, fields: StationFields): Promise<number> {
    return Number(
      (await em.getRepository(WeatherStationEntity).insert({ organisationId, ...fields })).identifiers[0]!['id'],
    );
  }

  async update(em: EntityManager, stationId: number, fields: Partial<StationFields>): Promise<void> {
    if (Object.keys(fields).length) await em.getRepository(WeatherStationEntity).update({ id: stationId }, fields);
  }

  async days(stationId: number, from: string, to: string): Promise<DailyRecord[]> {
    const rows = await this.db
      .getRepository(DailyWeatherEntity)
      .createQueryBuilder('d')
      .select(['d.date', 'd.etoMm', 'd.rainMm', 'd.method', 'd.source'])
      .where('d.station_id = :stationId AND d.date BETWEEN :from AND :to', { stationId, from, to })
      .orderBy('d.date', 'ASC')
      .getMany();
    return rows.map((r) => ({ date: r.date, etoMm: r.etoMm, rainMm: r.rainMm, method: r.method, source: r.source }));
  }

  /** Inserts or replaces days by (station, date); returns how many were new, changed and already identical. */
  async upsertDays(
    em: EntityManager,
    stationId: number,
    days: DayToStore[],
  ): Promise<{ inserted: number; updated: number; unchanged: number }> {
    const counts = { inserted: 0, updated: 0, unchanged: 0 };
    if (!days.length) return counts;
    await this.touchStation(em, stationId);
    const repo = em.getRepository(DailyWeatherEntity);
    const dates = days.map((d) => d.date);
    const existing = new Map<string, DailyWeatherEntity>();
    for (let i = 0; i < dates.length; i += 1000) {
      const found = await repo
        .createQueryBuilder('d')
        .where('d.station_id = :stationId AND d.date IN (:...dates)', { stationId, dates: dates.slice(i, i + 1000) })
        .getMany();
      for (const row of found) existing.set(row.date, row);
    }
    const toInsert: Partial<DailyWeatherEntity>[] = [];
    for (const day of days) {
      const before = existing.get(day.date);
      if (!before) {
        toInsert.push({ stationId, ...day });
        counts.inserted++;
      } else if (
        before.etoMm === day.etoMm &&
        before.rainMm === day.rainMm &&
        before.method === day.method &&
        before.source === day.source &&
        before.observations === day.observations
      ) {
        counts.unchanged++;
      } else {
        await repo.update({ id: before.id }, { ...day, updatedAt: new Date() });
        counts.updated++;
      }
    }
    for (let i = 0; i < toInsert.length; i += 1000) await repo.insert(toInsert.slice(i, i + 1000));
    return counts;
  }

  /**
   * The nearest other station of the same organisation within `maxKm` (equirectangular distance, plenty at this
   * range), to stand in for days a station missed; null when there is none.
   */
  async nearestStation(stationId: number, maxKm: number): Promise<{ id: number; name: string; km: number } | null> {
    const rows: { id: number; name: string; km: number }[] = await this.db.query(
      `SELECT o.id, o.name, 6371 * SQRT(POW(RADIANS(o.latitude - s.latitude), 2)
          + POW(RADIANS(o.longitude - s.longitude) * COS(RADIANS((o.latitude + s.latitude) / 2)), 2)) AS km
        FROM weather_station s JOIN weather_station o ON o.organisation_id = s.organisation_id AND o.id <> s.id
        WHERE s.id = ? HAVING km <= ? ORDER BY km, o.id LIMIT 1`,
      [stationId, maxKm],
    );
    return rows[0] ? { id: rows[0].id, name: rows[0].name, km: Number(rows[0].km) } : null;
  }

  /** Per station: its name and organisation, the dates with both values stored in [from, to], and its first date. */
  async coverage(
    stationIds: number[],
    from: string,
    to: string,
  ): Promise<{ id: number; name: string; organisationId: number; firstDate: string | null; dates: string[] }[]> {
    if (stationIds.length === 0) return [];
    const stations: { id: number; name: string; organisation_id: number; first_date: string | null }[] =
      await this.db.query(
        `SELECT ws.id, ws.name, ws.organisation_id,
           (SELECT DATE_FORMAT(MIN(d.date), '%Y-%m-%d') FROM daily_weather d WHERE d.station_id = ws.id) AS first_date
         FROM weather_station ws WHERE ws.id IN (?) ORDER BY ws.id`,
        [stationIds],
      );
    const days: { station_id: number; date: string }[] = await this.db.query(
      `SELECT station_id, DATE_FORMAT(date, '%Y-%m-%d') AS date FROM daily_weather
        WHERE station_id IN (?) AND date BETWEEN ? AND ? AND eto_mm IS NOT NULL AND rain_mm IS NOT NULL`,
      [stationIds, from, to],
    );
    return stations.map((st) => ({
      id: st.id,
      name: st.name,
      organisationId: st.organisation_id,
      firstDate: st.first_date,
      dates: days.filter((d) => d.station_id === st.id).map((d) => d.date),
    }));
  }

  async normals(stationId: number): Promise<MonthlyNormalDto[]> {
    const rows = await this.db
      .getRepository(MonthlyWeatherNormalEntity)
      .find({ where: { stationId }, order: { month: 'ASC' } });
    return rows.map((r) => ({ month: r.month, etoMm: r.etoMm, rainMm: r.rainMm }));
  }

  /**
   * New weather changes every budget computed from this station: its `updated_at` is what cached budgets compare with.
   */
  private async touchStation(em: EntityManager, stationId: number): Promise<void> {
    await em.query('UPDATE weather_station SET updated_at = NOW(3) WHERE id = ?', [stationId]);
  }

  async replaceNormals(em: EntityManager, stationId: number, normals: MonthlyNormalDto[]): Promise<void> {
    await this.touchStation(em, stationId);
    await em.getRepository(MonthlyWeatherNormalEntity).delete({ stationId });
    if (normals.length)
      await em.getRepository(MonthlyWeatherNormalEntity).insert(normals.map((n) => ({ stationId, ...n })));
  }

  async stationIdOfSite(siteId: number): Promise<number | null> {
    const site = await this.db
      .getRepository(SiteEntity)
      .findOne({ where: { id: siteId }, select: { id: true, weatherStationId: true } });
    return site?.weatherStationId ?? null;
  }

  async linkSite(em: EntityManager, siteId: number, stationId: number | null): Promise<void> {
    await em.getRepository(SiteEntity).update({ id: siteId }, { weatherStationId: stationId });
  }
}

function toRecord(r: Record<string, unknown>): StationRecord {
  return {
    id: Number(r['id']),
    organisationId: Number(r['organisationId']),
    organisationName: String(r['organisationName']),
    name: String(r['name']),
    latitude: Number(r['latitude']),
    longitude: Number(r['longitude']),
    elevationM: Number(r['elevationM']),
    windHeightM: Number(r['windHeightM']),
    exposure: r['exposure'] as StationExposure,
    sourceKind: r['sourceKind'] as StationSourceKind,
    dayCount: Number(r['dayCount'] ?? 0),
    firstDate: (r['firstDate'] as string | null) ?? null,
    lastDate: (r['lastDate'] as string | null) ?? null,
  };
}
