import type { DataSource } from 'typeorm';
import type { WatchRunDto } from '@shared/watch/watch-dto';

interface RunRow {
  id: number;
  trigger: WatchRunDto['trigger'];
  status: WatchRunDto['status'];
  range_from_utc: Date | null;
  range_to_utc: Date;
  started_at: Date;
  finished_at: Date | null;
  sites_checked: number;
  sites_skipped: number;
  findings: number;
  alerts_raised: number;
  alerts_updated: number;
  alerts_reopened: number;
  mails_queued: number;
  errors: string | null;
  warnings: string | null;
  site_ids: string | null;
  sites_total: number;
  sites_done: number;
  organisation_id: number | null;
}

export type RunCounts = Pick<
  WatchRunDto,
  'sitesChecked' | 'sitesSkipped' | 'findings' | 'alertsRaised' | 'alertsUpdated' | 'alertsReopened' | 'mailsQueued'
>;

/** The record of watch runs. */
export class WatchRunsRepository {
  constructor(private readonly db: DataSource) {}

  async start(
    r: {
      trigger: WatchRunDto['trigger'];
      organisationId: number | null;
      requestedBy: number | null;
      fromUtc?: Date;
      siteIds?: number[];
    },
    asOf: Date,
  ): Promise<number> {
    const result: { insertId: number } = await this.db.query(
      `INSERT INTO watch_run (organisation_id, requested_by, \`trigger\`, status, range_from_utc,
        range_to_utc, started_at, site_ids) VALUES (?, ?, ?, 'running', ?, ?, ?, ?)`,
      [
        r.organisationId,
        r.requestedBy,
        r.trigger,
        r.fromUtc ?? null,
        asOf,
        new Date(),
        r.siteIds ? JSON.stringify(r.siteIds) : null,
      ],
    );
    return result.insertId;
  }

  async progress(id: number, sitesTotal: number, sitesDone: number): Promise<void> {
    await this.db.query('UPDATE watch_run SET sites_total = ?, sites_done = ? WHERE id = ?', [
      sitesTotal,
      sitesDone,
      id,
    ]);
  }

  async finish(
    id: number,
    status: 'done' | 'failed',
    c: RunCounts,
    notes: { errors: WatchRunDto['errors']; warnings: WatchRunDto['warnings'] },
  ): Promise<void> {
    await this.db.query(
      `UPDATE watch_run SET status = ?, finished_at = ?, sites_checked = ?, sites_skipped = ?,
        findings = ?, alerts_raised = ?, alerts_updated = ?,
        alerts_reopened = ?, mails_queued = ?, errors = ?, warnings = ?,
        sites_done = sites_total WHERE id = ?`,
      [
        status,
        new Date(),
        c.sitesChecked,
        c.sitesSkipped,
        c.findings,
        c.alertsRaised,
        c.alertsUpdated,
        c.alertsReopened,
        c.mailsQueued,
        JSON.stringify(notes.errors),
        JSON.stringify(notes.warnings),
        id,
      ],
    );
  }

  async get(id: number): Promise<WatchRunDto | null> {
    const [row] = (await this.db.query('SELECT * FROM watch_run WHERE id = ?', [id])) as RunRow[];
    return row ? toDto(row) : null;
  }

  async ownSiteIds(organisationId: number): Promise<number[]> {
    const rows: { id: number }[] = await this.db.query('SELECT id FROM site WHERE organisation_id = ?', [
      organisationId,
    ]);
    return rows.map((r) => r.id);
  }

  /** The organisation's own runs and the scheduled runs over every site, newest first. */
  /** One run, with the organisation that asked for it (null for the scheduled run over every site). */
  async getWithOwner(id: number): Promise<(WatchRunDto & { organisationId: number | null }) | null> {
    const [row] = (await this.db.query('SELECT * FROM watch_run WHERE id = ?', [id])) as RunRow[];
    return row ? { ...toDto(row), organisationId: row.organisation_id } : null;
  }

  async list(
    organisationId: number,
    page: number,
    pageSize: number,
  ): Promise<{ items: (WatchRunDto & { organisationId: number | null })[]; total: number }> {
    const [{ n }] = (await this.db.query(
      'SELECT COUNT(*) AS n FROM watch_run WHERE organisation_id = ? OR organisation_id IS NULL',
      [organisationId],
    )) as [{ n: number | string }];
    const rows: RunRow[] = await this.db.query(
      'SELECT * FROM watch_run WHERE organisation_id = ? OR organisation_id IS NULL ORDER BY id DESC LIMIT ? OFFSET ?',
      [organisationId, pageSize, page * pageSize],
    );
    return { items: rows.map((r) => ({ ...toDto(r), organisationId: r.organisation_id })), total: Number(n) };
  }
}

function toDto(r: RunRow): WatchRunDto {
  return {
    id: r.id,
    trigger: r.trigger,
    status: r.status,
    rangeFromUtc: r.range_from_utc?.toISOString() ?? null,
    rangeToUtc: r.range_to_utc.toISOString(),
    startedAt: r.started_at.toISOString(),
    finishedAt: r.finished_at?.toISOString() ?? null,
    sitesChecked: r.sites_checked,
    sitesSkipped: r.sites_skipped,
    findings: r.findings,
    alertsRaised: r.alerts_raised,
    alertsUpdated: r.alerts_updated,
    alertsReopened: r.alerts_reopened,
    mailsQueued: r.mails_queued,
    siteIds: r.site_ids ? (JSON.parse(r.site_ids) as number[]) : null,
    sitesTotal: r.sites_total,
    sitesDone: r.sites_done,
    errors: r.errors ? (JSON.parse(r.errors) as WatchRunDto['errors']) : [],
    warnings: r.warnings ? (JSON.parse(r.warnings) as WatchRunDto['warnings']) : [],
  };
}
