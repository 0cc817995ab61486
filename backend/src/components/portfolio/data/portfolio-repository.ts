import type { DataSource } from 'typeorm';
import { lastDayOfMonth } from '@shared/portfolio/period';
import { jsonArray } from '../../../db/json-array';

/** One visible site with its aggregates over a period and over the year to date. */
export interface SiteAggregate {
  siteId: number;
  siteName: string;
  organisationId: number;
  organisationName: string;
  timeZone: string;
  useGallons: number;
  budgetGallons: number | null;
  ytdUseGallons: number;
  ytdBudgetGallons: number | null;
  lastDataAt: Date | null;
  budgetProblem: string | null;
  tags: string[];
}

export interface BudgetMonthRow {
  siteId: number;
  month: string;
  gallons: number | null;
  cost: number | null;
  currency: string | null;
  etoMm: number | null;
  rainMm: number | null;
  filledDays: number;
  problem: string | null;
}

export interface AggregateFilter {
  q?: string;
  tag?: string;
  organisationId?: number;
}

// Budget of a date range from whole-month cache rows: each month weighted by the share of its days in the range.
// NULL when any month is missing or has no computable budget, so a partial sum never looks like a budget.
const budgetOver = (alias: string) => `
  LEFT JOIN (SELECT b.site_id,
      IF(SUM(b.gallons IS NULL) > 0 OR COUNT(*) < ?, NULL,
         SUM(b.gallons * (DATEDIFF(LEAST(LAST_DAY(CONCAT(b.month, '-01')), ?), GREATEST(CONCAT(b.month, '-01'), ?)) + 1) / DAY(LAST_DAY(CONCAT(b.month, '-01'))))) AS gal,
      MAX(b.problem) AS problem
    FROM site_monthly_budget b WHERE b.month BETWEEN ? AND ? GROUP BY b.site_id) ${alias} ON ${alias}.site_id = s.id`;

/** Use per site over a date range: whole months from the monthly rollup, anything else from the daily one. */
function useOver(range: { from: string; to: string }): { sql: string; params: string[] } {
  const aligned = range.from.endsWith('-01') && range.to === lastDayOfMonth(range.to.slice(0, 7));
  return aligned
    ? {
        sql: 'SELECT site_id, SUM(gallons) AS gal FROM site_monthly_use WHERE month BETWEEN ? AND ? GROUP BY site_id',
        params: [range.from.slice(0, 7), range.to.slice(0, 7)],
      }
    : {
        sql: 'SELECT site_id, SUM(gallons) AS gal FROM site_daily_use WHERE local_date BETWEEN ? AND ? GROUP BY site_id',
        params: [range.from, range.to],
      };
}

/** Aggregate reads for the dashboard; every site list is scoped to what one organisation may see. */
export class PortfolioRepository {
  private alertTable: { status: boolean; resolvedAt: boolean; title: string | null; dateColumn: string } | null = null;

  constructor(private readonly db: DataSource) {}

  /** Every site the organisation may see (owned or shared), narrowed by the filter, with its sums; the latest reading per meter comes off the primary key. */
  async aggregates(
    viewerOrgId: number,
    f: AggregateFilter,
    period: { from: string; to: string; months: number },
    ytd: { from: string; to: string; months: number },
  ): Promise<SiteAggregate[]> {
    const where: string[] = ['(s.organisation_id = ? OR sh.organisation_id IS NOT NULL)'];
    const whereParams: unknown[] = [viewerOrgId];
    if (f.q) {
      where.push('s.name LIKE ?');
      whereParams.push(`%${f.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`);
    }
    if (f.tag) {
      where.push('EXISTS (SELECT 1 FROM site_tag t WHERE t.site_id = s.id AND t.tag = ?)');
      whereParams.push(f.tag);
    }
    if (f.organisationId) {
      where.push('s.organisation_id = ?');
      whereParams.push(f.organisationId);
    }
    const periodUse = useOver(period);
    const ytdUse = useOver(ytd);
    const rows: Record<string, unknown>[] = await this.db.query(
      `SELECT s.id AS siteId, s.name AS siteName, s.organisation_id AS organisationId, o.name AS organisationName, s.time_zone AS timeZone,
              COALESCE(u.gal, 0) AS useGal, b.gal AS budgetGal, COALESCE(yu.gal, 0) AS ytdUseGal, yb.gal AS ytdBudgetGal,
              ld.last AS lastDataAt, b.problem AS problem,
              (SELECT JSON_ARRAYAGG(t.tag ORDER BY t.tag) FROM site_tag t WHERE t.site_id = s.id) AS tagsJson
       FROM site s
       JOIN organisation o ON o.id = s.organisation_id
       LEFT JOIN site_share sh ON sh.site_id = s.id AND sh.organisation_id = ?
       LEFT JOIN (${periodUse.sql}) u ON u.site_id = s.id
       LEFT JOIN (${ytdUse.sql}) yu ON yu.site_id = s.id
       ${budgetOver('b')}
       ${budgetOver('yb')}
       LEFT JOIN (SELECT m.site_id, MAX((SELECT r.start_utc + INTERVAL r.minutes MINUTE FROM meter_reading r WHERE r.meter_id = m.id ORDER BY r.start_utc DESC LIMIT 1)) AS last
                  FROM meter m GROUP BY m.site_id) ld ON ld.site_id = s.id
       WHERE ${where.join(' AND ')}`,
      [
        viewerOrgId,
        ...periodUse.params,
        ...ytdUse.params,
        period.months,
        period.to,
        period.from,
        period.from.slice(0, 7),
        period.to.slice(0, 7),
        ytd.months,
        ytd.to,
        ytd.from,
        ytd.from.slice(0, 7),
        ytd.to.slice(0, 7),
        ...whereParams,
      ],
    );
    return rows.map((r) => ({
      siteId: Number(r['siteId']),
      siteName: String(r['siteName']),
      organisationId: Number(r['organisationId']),
      organisationName: String(r['organisationName']),
      timeZone: String(r['timeZone']),
      useGallons: Number(r['useGal']),
      budgetGallons: r['budgetGal'] === null ? null : Number(r['budgetGal']),
      ytdUseGallons: Number(r['ytdUseGal']),
      ytdBudgetGallons: r['ytdBudgetGal'] === null ? null : Number(r['ytdBudgetGal']),
      lastDataAt: r['lastDataAt'] ? new Date(r['lastDataAt'] as string) : null,
      budgetProblem: (r['problem'] as string | null) ?? null,
      tags: jsonArray(r['tagsJson']),
    }));
  }

  /**
   * Sites among `siteIds` missing a cache row for some month, or holding one that is too old or older than a
   * change to what it was computed from (the site, its hydrozones, rate schedules or weather station).
   */
  async staleBudgetSites(siteIds: number[], months: string[], currentMonth: string): Promise<number[]> {
    if (!siteIds.length || !months.length) return [];
    // Past months are kept a day, the current and later months an hour (their weather is still arriving).
    const rows: { siteId: number }[] = await this.db.query(
      `SELECT s.id AS siteId FROM site s
       LEFT JOIN (SELECT b.site_id, COUNT(*) AS n FROM site_monthly_budget b
                  JOIN site bs ON bs.id = b.site_id
                  LEFT JOIN weather_station ws ON ws.id = bs.weather_station_id
                  WHERE b.site_id IN (?) AND b.month IN (?)
                    AND b.computed_at > IF(b.month >= ?, NOW(3) - INTERVAL 1 HOUR, NOW(3) - INTERVAL 1 DAY)
                    -- TypeORM stamps updated_at to the whole second, so a change counts for its whole second.
                    AND b.computed_at >= GREATEST(bs.updated_at, COALESCE(ws.updated_at, bs.updated_at),
                      COALESCE((SELECT MAX(h.updated_at) FROM hydrozone h WHERE h.site_id = b.site_id), bs.updated_at),
                      COALESCE((SELECT MAX(r.updated_at) FROM rate_schedule r WHERE r.site_id = b.site_id), bs.updated_at)) + INTERVAL 1 SECOND
                  GROUP BY b.site_id) c ON c.site_id = s.id
       WHERE s.id IN (?) AND COALESCE(c.n, 0) < ?`,
      [siteIds, months, currentMonth, siteIds, months.length],
    );
    return rows.map((r) => Number(r.siteId));
  }

  async saveBudgetMonths(rows: BudgetMonthRow[]): Promise<void> {
    if (!rows.length) return;
    await this.db.query(
      `INSERT INTO site_monthly_budget (site_id, month, gallons, cost, currency, eto_mm, rain_mm, filled_days, problem, computed_at) VALUES ?
       ON DUPLICATE KEY UPDATE gallons = VALUES(gallons), cost = VALUES(cost), currency = VALUES(currency), eto_mm = VALUES(eto_mm),
         rain_mm = VALUES(rain_mm), filled_days = VALUES(filled_days), problem = VALUES(problem), computed_at = VALUES(computed_at)`,
      [
        rows.map((r) => [
          r.siteId,
          r.month,
          r.gallons,
          r.cost,
          r.currency,
          r.etoMm,
          r.rainMm,
          r.filledDays,
          r.problem?.slice(0, 300) ?? null,
          new Date(),
        ]),
      ],
    );
  }

  async budgetMonths(siteIds: number[], fromMonth: string, toMonth: string): Promise<BudgetMonthRow[]> {
    if (!siteIds.length) return [];
    const rows: Record<string, unknown>[] = await this.db.query(
      `SELECT site_id AS siteId, month, gallons, cost, currency, eto_mm AS etoMm, rain_mm AS rainMm, filled_days AS filledDays, problem
       FROM site_monthly_budget WHERE site_id IN (?) AND month BETWEEN ? AND ? ORDER BY site_id, month`,
      [siteIds, fromMonth, toMonth],
    );
    return rows.map((r) => ({
      siteId: Number(r['siteId']),
      month: String(r['month']),
      gallons: r['gallons'] === null ? null : Number(r['gallons']),
      cost: r['cost'] === null ? null : Number(r['cost']),
      currency: (r['currency'] as string | null) ?? null,
      etoMm: r['etoMm'] === null ? null : Number(r['etoMm']),
      rainMm: r['rainMm'] === null ? null : Number(r['rainMm']),
      filledDays: Number(r['filledDays']),
      problem: (r['problem'] as string | null) ?? null,
    }));
  }

  /** Open alerts per site, over every site the organisation may see (owned or shared); the caller keeps the ones in scope. */
  async openAlerts(viewerOrgId: number): Promise<Map<number, number>> {
    const map = new Map<number, number>();
    const table = await this.alerts();
    if (!table) return map;
    const open = table.status ? "AND a.status <> 'resolved'" : table.resolvedAt ? 'AND a.resolved_at IS NULL' : '';
    const rows: { siteId: number; n: number }[] = await this.db.query(
      `SELECT a.site_id AS siteId, COUNT(*) AS n FROM alert a JOIN site s ON s.id = a.site_id
       LEFT JOIN site_share sh ON sh.site_id = s.id AND sh.organisation_id = ?
       WHERE (s.organisation_id = ? OR sh.organisation_id IS NOT NULL) ${open} GROUP BY a.site_id`,
      [viewerOrgId, viewerOrgId],
    );
    for (const r of rows) map.set(Number(r.siteId), Number(r.n));
    return map;
  }

  async alertMarkers(
    siteId: number,
    timeZone: string,
    from: string,
    to: string,
  ): Promise<{ id: number; date: string; title: string; status: string }[]> {
    const table = await this.alerts();
    if (!table) return [];
    const rows: Record<string, unknown>[] = await this.db.query(
      `SELECT id, DATE_FORMAT(CONVERT_TZ(${table.dateColumn}, '+00:00', ?), '%Y-%m-%d') AS date, ${table.title ?? "'Alert'"} AS title, ${table.status ? "IF(status = 'resolved', 'resolved', 'open')" : table.resolvedAt ? "IF(resolved_at IS NULL, 'open', 'resolved')" : "'open'"} AS status
       FROM alert WHERE site_id = ? HAVING date BETWEEN ? AND ? ORDER BY date LIMIT 500`,
      [timeZone, siteId, from, to],
    );
    return rows.map((r) => ({
      id: Number(r['id']),
      date: String(r['date']),
      title: String(r['title']),
      status: String(r['status']),
    }));
  }

  async alertsAvailable(): Promise<boolean> {
    return (await this.alerts()) !== null;
  }

  /** Looks the alert table up once it exists (it arrives with the nightly-watch work); the shape is probed, not assumed. */
  private async alerts() {
    if (this.alertTable) return this.alertTable;
    const cols: { name: string }[] = await this.db.query(
      "SELECT COLUMN_NAME AS name FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'alert'",
    );
    if (!cols.length) return null;
    const names = new Set(cols.map((c) => c.name));
    const dateColumn = ['period_start_utc', 'first_detected_at', 'created_at'].find((c) => names.has(c));
    if (!names.has('site_id') || !dateColumn) return null;
    // Acknowledged alerts are still open work; only resolved ones are closed.
    this.alertTable = {
      status: names.has('status'),
      resolvedAt: names.has('resolved_at'),
      title: names.has('title') ? 'title' : names.has('kind') ? 'kind' : null,
      dateColumn,
    };
    return this.alertTable;
  }
}
