import type { DataSource } from 'typeorm';
import type { MeterHour, ZoneFacts, ZoneRun } from '@shared/watch/watch-inputs';
import type { RuntimeCause } from '@shared/ingest/ingest-records';

export interface WatchSiteRow {
  siteId: number;
  organisationId: number;
  name: string;
  timeZone: string;
  weatherStationId: number | null;
}

export interface SiteSettingsRow {
  thresholds: Record<string, number>;
  irrigationStartHour: number;
  irrigationEndHour: number;
}

export interface SiteStateRow {
  lastDataUtc: Date | null;
  lastCheckedAsOfUtc: Date | null;
  lastNight: string | null;
}

/** Reads what the watch needs per site, as plain objects; meter data arrives summed per UTC hour. */
export class WatchDataRepository {
  constructor(private readonly db: DataSource) {}

  async sites(organisationId: number | null): Promise<WatchSiteRow[]> {
    const rows: {
      id: number;
      organisation_id: number;
      name: string;
      time_zone: string;
      weather_station_id: number | null;
    }[] = await this.db.query(
      `SELECT id, organisation_id, name, time_zone, weather_station_id FROM site
        ${organisationId === null ? '' : 'WHERE organisation_id = ?'} ORDER BY id`,
      organisationId === null ? [] : [organisationId],
    );
    return rows.map((r) => ({
      siteId: r.id,
      organisationId: r.organisation_id,
      name: r.name,
      timeZone: r.time_zone,
      weatherStationId: r.weather_station_id,
    }));
  }

  async settingsOf(siteIds: number[]): Promise<Map<number, SiteSettingsRow>> {
    const out = new Map<number, SiteSettingsRow>();
    if (siteIds.length === 0) return out;
    const rows: { site_id: number; thresholds: string; irrigation_start_hour: number; irrigation_end_hour: number }[] =
      await this.db.query(
        `SELECT site_id, thresholds, irrigation_start_hour, irrigation_end_hour FROM
          site_watch_settings WHERE site_id IN (?)`,
        [siteIds],
      );
    for (const r of rows)
      out.set(r.site_id, {
        thresholds: JSON.parse(r.thresholds) as Record<string, number>,
        irrigationStartHour: r.irrigation_start_hour,
        irrigationEndHour: r.irrigation_end_hour,
      });
    return out;
  }

  async statesOf(siteIds: number[]): Promise<Map<number, SiteStateRow>> {
    const out = new Map<number, SiteStateRow>();
    if (siteIds.length === 0) return out;
    const rows: {
      site_id: number;
      last_data_utc: Date | null;
      last_checked_as_of_utc: Date | null;
      last_night: string | null;
    }[] = await this.db.query(
      `SELECT site_id, last_data_utc, last_checked_as_of_utc, DATE_FORMAT(last_night, '%Y-%m-%d')
        AS last_night FROM watch_site_state WHERE site_id IN (?)`,
      [siteIds],
    );
    for (const r of rows)
      out.set(r.site_id, {
        lastDataUtc: r.last_data_utc,
        lastCheckedAsOfUtc: r.last_checked_as_of_utc,
        lastNight: r.last_night,
      });
    return out;
  }

  /** Latest reading or runtime start per site (one grouped query each, by the tables' primary keys). */
  async latestDataOf(siteIds: number[]): Promise<Map<number, Date>> {
    const out = new Map<number, Date>();
    if (siteIds.length === 0) return out;
    const put = (rows: { site_id: number; latest: Date | null }[]) => {
      for (const r of rows)
        if (r.latest && (!out.has(r.site_id) || out.get(r.site_id)! < r.latest)) out.set(r.site_id, r.latest);
    };
    put(
      await this.db.query(
        `SELECT m.site_id, MAX(x.latest) AS latest FROM meter m
       JOIN (SELECT meter_id, MAX(start_utc) AS latest FROM meter_reading GROUP BY meter_id) x ON x.meter_id = m.id
       WHERE m.site_id IN (?) GROUP BY m.site_id`,
        [siteIds],
      ),
    );
    put(
      await this.db.query(
        `SELECT c.site_id, MAX(e.start_utc) AS latest FROM runtime_event e JOIN zone z ON z.id = e.zone_id
       JOIN controller c ON c.id = z.controller_id WHERE c.site_id IN (?) GROUP BY c.site_id`,
        [siteIds],
      ),
    );
    return out;
  }

  async meterHours(siteId: number, fromUtc: Date, toUtc: Date): Promise<MeterHour[]> {
    const rows: { h: number; gal: string | number }[] = await this.db.query(
      `SELECT TIMESTAMPDIFF(HOUR, '1970-01-01', r.start_utc) * 3600 AS h, SUM(r.volume_gal) AS gal
       FROM meter_reading r JOIN meter m ON m.id = r.meter_id
       WHERE m.site_id = ? AND r.start_utc >= ? AND r.start_utc < ? AND r.minutes <= 60 GROUP BY h ORDER BY h`,
      [siteId, fromUtc, toUtc],
    );
    return rows.map((r) => ({ startUtc: Number(r.h) * 1000, gallons: Number(r.gal) }));
  }

  /**
   * Readings longer than an hour (daily or monthly reads): they cannot be spread over hours, only totalled by month.
   */
  async longReadings(siteId: number, fromUtc: Date, toUtc: Date): Promise<{ startUtc: number; gallons: number }[]> {
    const rows: { s: number; gal: string }[] = await this.db.query(
      `SELECT TIMESTAMPDIFF(SECOND, '1970-01-01', r.start_utc) AS s, r.volume_gal AS gal FROM
        meter_reading r JOIN meter m ON m.id = r.meter_id
       WHERE m.site_id = ? AND r.start_utc >= ? AND r.start_utc < ? AND r.minutes > 60 ORDER BY r.start_utc`,
      [siteId, fromUtc, toUtc],
    );
    return rows.map((r) => ({ startUtc: Number(r.s) * 1000, gallons: Number(r.gal) }));
  }

  async zones(siteId: number): Promise<ZoneFacts[]> {
    const rows: { id: number; design_gpm: number | null; station: string; name: string }[] = await this.db.query(
      `SELECT z.id, z.design_gpm, z.station, z.name FROM zone z JOIN controller c ON c.id =
        z.controller_id WHERE c.site_id = ? ORDER BY z.id`,
      [siteId],
    );
    return rows.map((r) => ({
      zoneId: String(r.id),
      designGpm: r.design_gpm ?? 0,
      label: zoneLabel(r.station, r.name),
    }));
  }

  async runs(siteId: number, fromUtc: Date, toUtc: Date): Promise<ZoneRun[]> {
    const rows: {
      zone_id: number;
      s: number;
      minutes: number;
      cause: RuntimeCause | null;
      measured_gallons: string | null;
    }[] = await this.db.query(
      `SELECT e.zone_id, TIMESTAMPDIFF(SECOND, '1970-01-01', e.start_utc) AS s, e.minutes, e.cause, e.measured_gallons
       FROM runtime_event e JOIN zone z ON z.id = e.zone_id JOIN controller c ON c.id = z.controller_id
       WHERE c.site_id = ? AND e.start_utc >= ? AND e.start_utc < ? ORDER BY e.start_utc`,
      [siteId, fromUtc, toUtc],
    );
    return rows.map((r) => ({
      zoneId: String(r.zone_id),
      startUtc: Number(r.s) * 1000,
      minutes: r.minutes,
      cause: r.cause,
      ...(r.measured_gallons === null ? {} : { measuredGallons: Number(r.measured_gallons) }),
    }));
  }

  async saveState(siteId: number, lastDataUtc: Date | null, asOfUtc: Date, lastNight: string | null): Promise<void> {
    await this.db.query(
      `INSERT INTO watch_site_state (site_id, last_data_utc, last_checked_as_of_utc, last_night)
        VALUES (?, ?, ?, ?)
       ON DUPLICATE KEY UPDATE last_data_utc = VALUES(last_data_utc),
       last_checked_as_of_utc = VALUES(last_checked_as_of_utc),
       last_night = COALESCE(VALUES(last_night), last_night)`,
      [siteId, lastDataUtc, asOfUtc, lastNight],
    );
  }
}

/** `Station 4 “Front beds”`; just `Station 4` when the zone has no name of its own (or is named after its station). */
export function zoneLabel(station: string, name: string): string {
  const plain = `Station ${station}`;
  return !name.trim() || name.trim().toLowerCase() === plain.toLowerCase() ? plain : `${plain} “${name.trim()}”`;
}
