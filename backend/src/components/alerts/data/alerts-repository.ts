import type { DataSource, EntityManager } from 'typeorm';
import type { Finding } from '@shared/watch/finding';
import type {
  AlertAction,
  AlertDetailDto,
  AlertEventDto,
  AlertListFilter,
  AlertSummaryDto,
} from '@shared/alerts/alert-dto';

export type FileOutcome = 'raised' | 'updated' | 'reopened' | 'unchanged';

/** An open alert this close after the previous episode's end is the same episode seen again from a new window. */
const SAME_EPISODE_GAP_MS = 24 * 3_600_000;

const SORT_COLUMNS: Record<AlertListFilter['sort'], string> = {
  detected: 'a.first_detected_at',
  lastSeen: 'a.last_seen_at',
  severity: "FIELD(a.severity, 'watch', 'act-soon', 'act-now')",
  waterLost: 'a.water_lost_gal',
  site: 's.name',
  period: 'a.period_start_utc',
};

const SUMMARY_COLUMNS = `a.id, a.site_id, s.name AS site_name, s.time_zone, a.kind, a.sub_kind, a.zone_id,
  z.name AS zone_name,
  a.period_start_utc, a.period_end_utc, a.severity, a.status, a.ongoing, a.water_lost_gal, a.money_lost, a.currency,
  a.first_detected_at, a.last_seen_at, a.reopen_count`;

interface AlertRow {
  id: number;
  site_id: number;
  site_name: string;
  time_zone: string;
  kind: string;
  sub_kind: string;
  zone_id: number | null;
  zone_name: string | null;
  period_start_utc: Date;
  period_end_utc: Date;
  severity: string;
  status: string;
  ongoing: number;
  water_lost_gal: number | null;
  money_lost: number | null;
  currency: string | null;
  first_detected_at: Date;
  last_seen_at: Date;
  reopen_count: number;
}

const visibleJoin = `JOIN site s ON s.id = a.site_id LEFT JOIN site_share sh ON sh.site_id = s.id
  AND sh.organisation_id = ?
  LEFT JOIN zone z ON z.id = a.zone_id`;
const visibleWhere = '(s.organisation_id = ? OR sh.organisation_id IS NOT NULL)';

/** Alerts and their events: filing findings idempotently, and the inbox's reads. Plain objects out. */
export class AlertsRepository {
  constructor(private readonly db: DataSource) {}

  /**
   * Files one finding: the same key updates its alert; otherwise the condition's latest alert is extended (same
   * episode seen from a shifted window), reopened (the condition came back after it was resolved), or a new alert
   * is raised. A resolved alert whose finding shows nothing past what was seen when it was resolved stays resolved.
   */
  async fileFinding(
    em: EntityManager,
    f: Finding,
    now: Date,
  ): Promise<{ outcome: FileOutcome; alertId: number | null }> {
    const siteId = Number(f.siteId);
    const [byKey] = (await em.query(
      'SELECT id, status, resolved_at, period_end_utc FROM alert WHERE site_id = ? AND finding_key = ? FOR UPDATE',
      [siteId, f.key],
    )) as ExistingRow[];
    const existing =
      byKey ??
      (
        (await em.query(
          `SELECT id, status, resolved_at, period_end_utc FROM alert WHERE site_id = ? AND
            condition_key = ? ORDER BY period_start_utc DESC, id DESC LIMIT 1 FOR UPDATE`,
          [siteId, f.conditionKey],
        )) as ExistingRow[]
      )[0];
    if (existing) {
      if (existing.status === 'resolved') {
        // Data time, not wall time: the person resolved it having seen data up to the period's end; waste after that is
        // the condition returning.
        if (f.periodEndUtc > existing.period_end_utc.getTime()) {
          await this.update(em, existing.id, f, now, 'open');
          await em.query('UPDATE alert SET reopen_count = reopen_count + 1, resolved_at = NULL WHERE id = ?', [
            existing.id,
          ]);
          await this.addEvent(em, existing.id, null, 'reopened', 'The condition came back after it was resolved.');
          return { outcome: 'reopened', alertId: existing.id };
        }
        return { outcome: 'unchanged', alertId: existing.id };
      }
      const sameEpisode =
        byKey !== undefined || f.periodStartUtc <= existing.period_end_utc.getTime() + SAME_EPISODE_GAP_MS;
      if (sameEpisode) {
        const changed = await this.update(em, existing.id, f, now, null);
        return { outcome: changed ? 'updated' : 'unchanged', alertId: existing.id };
      }
    }
    const result: { insertId: number } = await em.query(
      `INSERT INTO alert (site_id, kind, sub_kind, zone_id, finding_key, condition_key,
        period_start_utc, period_end_utc, severity, status, ongoing,
        evidence, water_lost_gal, money_lost, currency, explanation, first_detected_at, last_seen_at)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, 'open', ?, ?, ?, ?, ?, ?, ?, ?)`,
      [
        siteId,
        f.kind,
        f.subKind,
        f.zoneId ? Number(f.zoneId) : null,
        f.key,
        f.conditionKey,
        new Date(f.periodStartUtc),
        new Date(f.periodEndUtc),
        f.severity,
        f.ongoing,
        evidenceOf(f),
        f.waterLostGal,
        f.moneyLost?.amount ?? null,
        f.moneyLost?.currency ?? null,
        f.explanation,
        now,
        now,
      ],
    );
    await this.addEvent(em, result.insertId, null, 'opened', null);
    return { outcome: 'raised', alertId: result.insertId };
  }

  /** Refreshes period end, loss and evidence; true when anything a person would notice changed. */
  private async update(em: EntityManager, id: number, f: Finding, now: Date, status: 'open' | null): Promise<boolean> {
    const result: { changedRows: number } = await em.query(
      `UPDATE alert SET period_end_utc = GREATEST(period_end_utc, ?), severity = ?, ongoing = ?,
        evidence = ?, water_lost_gal = ?, money_lost = ?,
        currency = ?, explanation = ?${status ? ', status = ?' : ''} WHERE id = ?`,
      [
        new Date(f.periodEndUtc),
        f.severity,
        f.ongoing,
        evidenceOf(f),
        f.waterLostGal,
        f.moneyLost?.amount ?? null,
        f.moneyLost?.currency ?? null,
        f.explanation,
        ...(status ? [status] : []),
        id,
      ],
    );
    await em.query('UPDATE alert SET last_seen_at = ? WHERE id = ?', [now, id]);
    return result.changedRows > 0;
  }

  async addEvent(
    em: EntityManager,
    alertId: number,
    userId: number | null,
    action: AlertAction,
    note: string | null,
  ): Promise<void> {
    await em.query('INSERT INTO alert_event (alert_id, user_id, action, note, at) VALUES (?, ?, ?, ?, ?)', [
      alertId,
      userId,
      action,
      note,
      new Date(),
    ]);
  }

  async list(viewerOrgId: number, filter: AlertListFilter): Promise<{ items: AlertSummaryDto[]; total: number }> {
    const where = [visibleWhere];
    const params: unknown[] = [viewerOrgId, viewerOrgId];
    const narrow = (condition: string, value: unknown) => {
      where.push(condition);
      params.push(value);
    };
    if (filter.status) narrow('a.status = ?', filter.status);
    if (filter.kind) narrow('a.kind = ?', filter.kind);
    if (filter.siteId) narrow('a.site_id = ?', filter.siteId);
    const base = `FROM alert a ${visibleJoin} WHERE ${where.join(' AND ')}`;
    const [{ n }] = (await this.db.query(`SELECT COUNT(*) AS n ${base}`, params)) as [{ n: number | string }];
    const rows: AlertRow[] = await this.db.query(
      `SELECT ${SUMMARY_COLUMNS} ${base} ORDER BY ${SORT_COLUMNS[filter.sort]}
        ${filter.dir === 'asc' ? 'ASC' : 'DESC'}, a.id DESC LIMIT ? OFFSET ?`,
      [...params, filter.pageSize, filter.page * filter.pageSize],
    );
    return { items: rows.map(toSummary), total: Number(n) };
  }

  /** One site's alerts whose period touches a local calendar month (the caller has checked access to the site). */
  async inMonth(siteId: number, month: string, nextMonth: string): Promise<AlertSummaryDto[]> {
    const rows: AlertRow[] = await this.db.query(
      `SELECT ${SUMMARY_COLUMNS} FROM alert a JOIN site s ON s.id = a.site_id LEFT JOIN zone z ON z.id = a.zone_id
       WHERE a.site_id = ? AND a.period_start_utc < CONVERT_TZ(?, s.time_zone, '+00:00')
         AND a.period_end_utc > CONVERT_TZ(?, s.time_zone, '+00:00')
       ORDER BY a.period_start_utc, a.id LIMIT 200`,
      [siteId, `${nextMonth}-01 00:00:00`, `${month}-01 00:00:00`],
    );
    return rows.map(toSummary);
  }

  async findVisible(
    viewerOrgId: number,
    id: number,
  ): Promise<(AlertSummaryDto & Pick<AlertDetailDto, 'evidence' | 'explanation'>) | null> {
    const [row] = (await this.db.query(
      `SELECT ${SUMMARY_COLUMNS}, a.evidence, a.explanation FROM alert a ${visibleJoin} WHERE a.id
        = ? AND ${visibleWhere}`,
      [viewerOrgId, id, viewerOrgId],
    )) as (AlertRow & { evidence: string; explanation: string })[];
    return row
      ? {
          ...toSummary(row),
          evidence: JSON.parse(row.evidence) as AlertDetailDto['evidence'],
          explanation: row.explanation,
        }
      : null;
  }

  async events(alertId: number): Promise<AlertEventDto[]> {
    const rows: {
      id: number;
      action: AlertAction;
      note: string | null;
      at: Date;
      user_id: number | null;
      display_name: string | null;
    }[] = await this.db.query(
      `SELECT e.id, e.action, e.note, e.at, e.user_id, u.display_name FROM alert_event e LEFT JOIN
        \`user\` u ON u.id = e.user_id WHERE e.alert_id = ? ORDER BY e.at, e.id`,
      [alertId],
    );
    return rows.map((r) => ({
      id: r.id,
      action: r.action,
      note: r.note,
      at: r.at.toISOString(),
      userId: r.user_id,
      userName: r.display_name ?? (r.user_id ? 'Former user' : 'Nightly watch'),
    }));
  }

  async setStatus(em: EntityManager, id: number, status: 'acknowledged' | 'resolved'): Promise<void> {
    await em.query(
      `UPDATE alert SET status = ?, resolved_at = ${status === 'resolved' ? '?' : 'NULL'} WHERE id = ?`,
      status === 'resolved' ? [status, new Date(), id] : [status, id],
    );
  }

  /** Open and acknowledged alerts per site, for dashboards. */
  async openCounts(siteIds: number[]): Promise<Map<number, number>> {
    const out = new Map<number, number>();
    if (siteIds.length === 0) return out;
    const rows: { site_id: number; n: number | string }[] = await this.db.query(
      "SELECT site_id, COUNT(*) AS n FROM alert WHERE status <> 'resolved' AND site_id IN (?) GROUP BY site_id",
      [siteIds],
    );
    for (const r of rows) out.set(r.site_id, Number(r.n));
    return out;
  }
}

interface ExistingRow {
  id: number;
  status: string;
  resolved_at: Date | null;
  period_end_utc: Date;
}

function evidenceOf(f: Finding): string {
  return JSON.stringify({
    numbers: f.evidence,
    series: f.series,
    suspectZoneIds: f.suspectZoneIds ?? [],
    detectedAtUtc: new Date(f.detectedAtUtc).toISOString(),
  });
}

function toSummary(r: AlertRow): AlertSummaryDto {
  return {
    id: r.id,
    siteId: r.site_id,
    siteName: r.site_name,
    timeZone: r.time_zone,
    kind: r.kind as AlertSummaryDto['kind'],
    subKind: r.sub_kind,
    zoneId: r.zone_id,
    zoneName: r.zone_name,
    periodStartUtc: r.period_start_utc.toISOString(),
    periodEndUtc: r.period_end_utc.toISOString(),
    severity: r.severity as AlertSummaryDto['severity'],
    status: r.status as AlertSummaryDto['status'],
    ongoing: Boolean(r.ongoing),
    waterLostGal: r.water_lost_gal,
    moneyLost: r.money_lost === null ? null : { amount: r.money_lost, currency: r.currency ?? 'USD' },
    firstDetectedAt: r.first_detected_at.toISOString(),
    lastSeenAt: r.last_seen_at.toISOString(),
    reopenCount: r.reopen_count,
  };
}
