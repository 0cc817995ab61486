import type { DataSource } from 'typeorm';

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

/** The `site_monthly_budget` cache: one row per site and month, with the budget or the reason there is none. */
export class BudgetCacheRepository {
  constructor(private readonly db: DataSource) {}

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
                    AND b.computed_at > IF(b.month >= ?, NOW(3) - INTERVAL 1 HOUR, NOW(3) -
        INTERVAL 1 DAY)
                    -- TypeORM stamps updated_at to the whole second, so a change counts for its whole second.
                    AND b.computed_at >= GREATEST(bs.updated_at, COALESCE(ws.updated_at, bs.updated_at),
                      COALESCE((SELECT MAX(h.updated_at) FROM hydrozone h WHERE h.site_id =
        b.site_id), bs.updated_at),
                      COALESCE((SELECT MAX(r.updated_at) FROM rate_schedule r WHERE r.site_id =
        b.site_id), bs.updated_at)) + INTERVAL 1 SECOND
                  GROUP BY b.site_id) c ON c.site_id = s.id
       WHERE s.id IN (?) AND COALESCE(c.n, 0) < ?`,
      [siteIds, months, currentMonth, siteIds, months.length],
    );
    return rows.map((r) => Number(r.siteId));
  }

  async saveBudgetMonths(rows: BudgetMonthRow[]): Promise<void> {
    if (!rows.length) return;
    await this.db.query(
      `INSERT INTO site_monthly_budget (site_id, month, gallons, cost, currency, eto_mm, rain_mm,
        filled_days, problem, computed_at) VALUES ?
       ON DUPLICATE KEY UPDATE gallons = VALUES(gallons), cost = VALUES(cost), currency =
        VALUES(currency), eto_mm = VALUES(eto_mm),
         rain_mm = VALUES(rain_mm), filled_days = VALUES(filled_days), problem = VALUES(problem),
        computed_at = VALUES(computed_at)`,
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
      `SELECT site_id AS siteId, month, gallons, cost, currency, eto_mm AS etoMm, rain_mm AS
        rainMm, filled_days AS filledDays, problem
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
}
