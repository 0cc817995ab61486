import type { DataSource } from 'typeorm';

/** The alert reads the dashboards need: open alerts per site and one site's alerts as chart markers. */
export class AlertFiguresRepository {
  private alertTable: { status: boolean; resolvedAt: boolean; title: string | null; dateColumn: string } | null = null;

  constructor(private readonly db: DataSource) {}

  /**
   * Open alerts per site, over every site the organisation may see (owned or shared); the caller keeps the ones in
   * scope.
   */
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

  /** Per site: alerts whose period touches the local calendar month, and how many of them are not resolved. */
  async monthCounts(
    siteIds: number[],
    month: string,
    nextMonth: string,
  ): Promise<Map<number, { inMonth: number; open: number }>> {
    const map = new Map<number, { inMonth: number; open: number }>();
    if (!siteIds.length || !(await this.alerts())) return map;
    const rows: { siteId: number; n: number | string; open: number | string }[] = await this.db.query(
      `SELECT a.site_id AS siteId, COUNT(*) AS n, SUM(a.status <> 'resolved') AS open
       FROM alert a JOIN site s ON s.id = a.site_id
       WHERE a.site_id IN (?) AND a.period_start_utc < CONVERT_TZ(?, s.time_zone, '+00:00')
         AND a.period_end_utc > CONVERT_TZ(?, s.time_zone, '+00:00')
       GROUP BY a.site_id`,
      [siteIds, `${nextMonth}-01 00:00:00`, `${month}-01 00:00:00`],
    );
    for (const r of rows) map.set(Number(r.siteId), { inMonth: Number(r.n), open: Number(r.open) });
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
    const statusColumn = table.status
      ? "IF(status = 'resolved', 'resolved', 'open')"
      : table.resolvedAt
        ? "IF(resolved_at IS NULL, 'open', 'resolved')"
        : "'open'";
    const rows: Record<string, unknown>[] = await this.db.query(
      `SELECT id, DATE_FORMAT(CONVERT_TZ(${table.dateColumn}, '+00:00', ?), '%Y-%m-%d') AS date,
        ${table.title ?? "'Alert'"} AS title,
        ${statusColumn} AS status
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

  /**
   * Looks the alert table up once it exists (it arrives with the nightly-watch work); the shape is probed, not assumed.
   */
  private async alerts() {
    if (this.alertTable) return this.alertTable;
    const cols: { name: string }[] = await this.db.query(
      `SELECT COLUMN_NAME AS name FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = DATABASE()
        AND TABLE_NAME = 'alert'`,
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
