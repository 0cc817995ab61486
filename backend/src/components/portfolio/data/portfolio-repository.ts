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
         SUM(b.gallons * (DATEDIFF(LEAST(LAST_DAY(CONCAT(b.month, '-01')), ?),
  GREATEST(CONCAT(b.month, '-01'), ?)) + 1) / DAY(LAST_DAY(CONCAT(b.month, '-01'))))) AS gal,
      MAX(b.problem) AS problem
    FROM site_monthly_budget b WHERE b.month BETWEEN ? AND ? GROUP BY b.site_id) ${alias} ON
  ${alias}.site_id = s.id`;

/** Use per site over a date range: whole months from the monthly rollup, anything else from the daily one. */
function useOver(range: { from: string; to: string }): { sql: string; params: string[] } {
  const aligned = range.from.endsWith('-01') && range.to === lastDayOfMonth(range.to.slice(0, 7));
  return aligned
    ? {
        sql: 'SELECT site_id, SUM(gallons) AS gal FROM site_monthly_use WHERE month BETWEEN ? AND ? GROUP BY site_id',
        params: [range.from.slice(0, 7), range.to.slice(0, 7)],
      }
    : {
        sql: `SELECT site_id, SUM(gallons) AS gal FROM site_daily_use WHERE local_date BETWEEN ?
          AND ? GROUP BY site_id`,
        params: [range.from, range.to],
      };
}

/** Aggregate reads for the dashboard; every site list is scoped to what one organisation may see. */
export class PortfolioRepository {
  constructor(private readonly db: DataSource) {}

  /**
   * Every site the organisation may see (owned or shared), narrowed by the filter, with its sums; the latest reading
   * per meter comes off the primary key.
   */
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
      `SELECT s.id AS siteId, s.name AS siteName, s.organisation_id AS organisationId, o.name AS
        organisationName, s.time_zone AS timeZone,
              COALESCE(u.gal, 0) AS useGal, b.gal AS budgetGal, COALESCE(yu.gal, 0) AS ytdUseGal,
        yb.gal AS ytdBudgetGal,
              ld.last AS lastDataAt, b.problem AS problem,
              (SELECT JSON_ARRAYAGG(t.tag ORDER BY t.tag) FROM site_tag t WHERE t.site_id = s.id)
        AS tagsJson
       FROM site s
       JOIN organisation o ON o.id = s.organisation_id
       LEFT JOIN site_share sh ON sh.site_id = s.id AND sh.organisation_id = ?
       LEFT JOIN (${periodUse.sql}) u ON u.site_id = s.id
       LEFT JOIN (${ytdUse.sql}) yu ON yu.site_id = s.id
       ${budgetOver('b')}
       ${budgetOver('yb')}
       LEFT JOIN (SELECT m.site_id, MAX((SELECT r.start_utc + INTERVAL r.minutes MINUTE FROM
        meter_reading r WHERE r.meter_id = m.id ORDER BY r.start_utc DESC LIMIT 1)) AS last
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
}
