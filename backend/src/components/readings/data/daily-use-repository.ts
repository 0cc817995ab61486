import type { DataSource, EntityManager } from 'typeorm';
import { READING_FLAGS, SPREAD_FLAGS } from '@shared/readings/reading-flags';
import { addMonths, lastDayOfMonth } from '@shared/portfolio/period';
import { addDays } from '@shared/weather/day-of-year';

export interface DailyUse {
  localDate: string;
  gallons: number;
  coveredMinutes: number;
  readingCount: number;
}

export interface MonthlyUse {
  siteId: number;
  month: string;
  gallons: number;
  coveredMinutes: number;
  days: number;
  /** Of `gallons`: from estimated reads, and spread from billing periods. */
  estimatedGallons: number;
  spreadGallons: number;
}

const DAY_MS = 86_400_000;

/**
 * The `site_daily_use` rollup. Local days come from MariaDB's time-zone tables (loaded by
 * ops/db/start.sh), so a day in Los Angeles is 23, 24 or 25 hours as the calendar says.
 */
export class DailyUseRepository {
  constructor(private readonly db: DataSource) {}

  /**
   * Recomputes the rollup for one site over the local days touched by [fromUtc, toUtc]. Call it in the
   * same transaction as the change to the readings (import, replacement, roll back).
   */
  async refresh(em: EntityManager, siteId: number, fromUtc: Date, toUtc: Date): Promise<void> {
    const [site]: { timeZone: string }[] = await em.query('SELECT time_zone AS timeZone FROM site WHERE id = ?', [
      siteId,
    ]);
    if (!site) return;
    const [bounds]: { first: string | null; last: string | null }[] = await em.query(
      `SELECT DATE(CONVERT_TZ(?, '+00:00', ?)) AS first, DATE(CONVERT_TZ(?, '+00:00', ?)) AS last`,
      [fromUtc, site.timeZone, toUtc, site.timeZone],
    );
    if (!bounds?.first || !bounds.last)
      throw new Error(
        `MariaDB cannot convert to time zone ${site.timeZone}; load the time-zone tables (bash ops/db/start.sh)`,
      );
    const first = dateOnly(bounds.first);
    const last = dateOnly(bounds.last);
    await em.query('DELETE FROM site_daily_use WHERE site_id = ? AND local_date BETWEEN ? AND ?', [
      siteId,
      first,
      last,
    ]);
    // A UTC window one day wider on each side holds every reading of those local days; HAVING trims it.
    await em.query(
      `INSERT INTO site_daily_use (site_id, local_date, gallons, covered_minutes, reading_count, estimated_gal,
        spread_gal)
       SELECT m.site_id, DATE(CONVERT_TZ(r.start_utc, '+00:00', ?)) AS d, SUM(r.volume_gal), SUM(r.minutes), COUNT(*),
        SUM(IF(r.flags & ${READING_FLAGS.estimated}, r.volume_gal, 0)),
        SUM(IF(r.flags & ${SPREAD_FLAGS}, r.volume_gal, 0))
       FROM meter_reading r JOIN meter m ON m.id = r.meter_id
       WHERE m.site_id = ? AND r.start_utc >= ? AND r.start_utc < ?
       GROUP BY m.site_id, d
       HAVING d BETWEEN ? AND ?`,
      [site.timeZone, siteId, new Date(fromUtc.getTime() - DAY_MS), new Date(toUtc.getTime() + DAY_MS), first, last],
    );
    await refreshMonths(em, siteId, first.slice(0, 7), last.slice(0, 7));
  }

  /** The time span of the readings one upload stored (null when it stored none). */
  async uploadSpan(em: EntityManager, uploadId: number): Promise<{ from: Date; to: Date } | null> {
    const [span]: { first: Date | null; last: Date | null }[] = await em.query(
      'SELECT MIN(start_utc) AS first, MAX(start_utc) AS last FROM meter_reading WHERE upload_id = ?',
      [uploadId],
    );
    return span?.first && span.last ? { from: new Date(span.first), to: new Date(span.last) } : null;
  }

  /** Per site, the time span of the readings one upload stored (an organisation's upload writes to several). */
  async uploadSpansBySite(
    em: EntityManager,
    uploadId: number,
  ): Promise<Array<{ siteId: number; from: Date; to: Date }>> {
    const rows: { site_id: number; first: Date; last: Date }[] = await em.query(
      `SELECT m.site_id, MIN(r.start_utc) AS first, MAX(r.start_utc) AS last FROM meter_reading r JOIN meter m ON
        m.id = r.meter_id WHERE r.upload_id = ? GROUP BY m.site_id`,
      [uploadId],
    );
    return rows.map((r) => ({ siteId: Number(r.site_id), from: new Date(r.first), to: new Date(r.last) }));
  }

  /** Rebuilds a whole site's rollup (seeding, repairs). */
  async rebuildSite(em: EntityManager, siteId: number): Promise<void> {
    const [range]: { first: Date | null; last: Date | null }[] = await em.query(
      `SELECT MIN(r.start_utc) AS first, MAX(r.start_utc) AS last FROM meter_reading r JOIN meter m
        ON m.id = r.meter_id WHERE m.site_id = ?`,
      [siteId],
    );
    await em.query('DELETE FROM site_daily_use WHERE site_id = ?', [siteId]);
    await em.query('DELETE FROM site_monthly_use WHERE site_id = ?', [siteId]);
    if (range?.first && range.last) await this.refresh(em, siteId, new Date(range.first), new Date(range.last));
  }

  async daily(siteId: number, fromDate: string, toDate: string): Promise<DailyUse[]> {
    const rows: Record<string, unknown>[] = await this.db.query(
      `SELECT local_date AS localDate, gallons, covered_minutes AS coveredMinutes, reading_count AS readingCount
       FROM site_daily_use WHERE site_id = ? AND local_date BETWEEN ? AND ? ORDER BY local_date`,
      [siteId, fromDate, toDate],
    );
    return rows.map((r) => ({
      localDate: dateOnly(r['localDate'] as string | Date),
      gallons: Number(r['gallons']),
      coveredMinutes: Number(r['coveredMinutes']),
      readingCount: Number(r['readingCount']),
    }));
  }

  /**
   * Metered use per site per calendar month (YYYY-MM) between two local dates: whole months come from the
   * monthly rollup, the days of a partial month at either edge from the daily one.
   */
  async monthly(siteIds: number[], fromDate: string, toDate: string): Promise<MonthlyUse[]> {
    if (!siteIds.length || toDate < fromDate) return [];
    const firstWhole = fromDate.endsWith('-01') ? fromDate.slice(0, 7) : addMonths(fromDate.slice(0, 7), 1);
    const lastWhole =
      toDate === lastDayOfMonth(toDate.slice(0, 7)) ? toDate.slice(0, 7) : addMonths(toDate.slice(0, 7), -1);
    const parts: string[] = [];
    const params: unknown[] = [];
    if (firstWhole <= lastWhole) {
      parts.push(
        `SELECT site_id, month, gallons, covered_minutes, days, estimated_gal, spread_gal FROM site_monthly_use
          WHERE site_id IN (?) AND month BETWEEN ? AND ?`,
      );
      params.push(siteIds, firstWhole, lastWhole);
    }
    // Days outside the whole months (none when the range is month-aligned).
    const dayRanges: [string, string][] =
      firstWhole <= lastWhole
        ? [
            [fromDate, `${firstWhole}-01` > fromDate ? addDays(`${firstWhole}-01`, -1) : ''],
            [lastDayOfMonth(lastWhole) < toDate ? addDays(lastDayOfMonth(lastWhole), 1) : '', toDate],
          ]
        : [[fromDate, toDate]];
    for (const [from, to] of dayRanges) {
      if (!from || !to || to < from) continue;
      parts.push(`SELECT site_id, DATE_FORMAT(local_date, '%Y-%m') AS month, SUM(gallons) AS
        gallons, SUM(covered_minutes) AS covered_minutes, COUNT(*) AS days, SUM(estimated_gal) AS estimated_gal,
        SUM(spread_gal) AS spread_gal
                  FROM site_daily_use WHERE site_id IN (?) AND local_date BETWEEN ? AND ? GROUP BY
        site_id, month`);
      params.push(siteIds, from, to);
    }
    const rows: Record<string, unknown>[] = await this.db.query(
      `SELECT site_id AS siteId, month, SUM(gallons) AS gallons, SUM(covered_minutes) AS
        coveredMinutes, SUM(days) AS days, SUM(estimated_gal) AS estimatedGallons, SUM(spread_gal) AS spreadGallons
       FROM (${parts.join(' UNION ALL ')}) AS u
       GROUP BY site_id, month ORDER BY site_id, month`,
      params,
    );
    return rows.map((r) => ({
      siteId: Number(r['siteId']),
      month: String(r['month']),
      gallons: Number(r['gallons']),
      coveredMinutes: Number(r['coveredMinutes']),
      days: Number(r['days']),
      estimatedGallons: Number(r['estimatedGallons']),
      spreadGallons: Number(r['spreadGallons']),
    }));
  }
}

/** Recomputes `site_monthly_use` for one site's months from its daily rows (same transaction as the daily refresh). */
export async function refreshMonths(
  em: EntityManager | DataSource,
  siteId: number,
  fromMonth: string,
  toMonth: string,
): Promise<void> {
  await em.query('DELETE FROM site_monthly_use WHERE site_id = ? AND month BETWEEN ? AND ?', [
    siteId,
    fromMonth,
    toMonth,
  ]);
  await em.query(
    `INSERT INTO site_monthly_use (site_id, month, gallons, covered_minutes, days, estimated_gal, spread_gal)
     SELECT site_id, DATE_FORMAT(local_date, '%Y-%m') AS m, SUM(gallons), SUM(covered_minutes), COUNT(*),
      SUM(estimated_gal), SUM(spread_gal)
     FROM site_daily_use WHERE site_id = ? AND local_date BETWEEN ? AND ? GROUP BY site_id, m`,
    [siteId, `${fromMonth}-01`, lastDayOfMonth(toMonth)],
  );
}

/** `YYYY-MM-DD` from a DATE column (mysql2 may hand back a Date at UTC midnight or a string). */
function dateOnly(value: string | Date): string {
  return value instanceof Date ? value.toISOString().slice(0, 10) : String(value).slice(0, 10);
}
