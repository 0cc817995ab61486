import type { DataSource, EntityManager } from 'typeorm';
import type {
  AlertResolution,
  RepairTimeRow,
  RepairVerificationDto,
  VerificationStatus,
} from '@shared/alerts/alert-dto';
import type { RuleWorklistRow } from '@shared/watering-rules/rules-dto';
import type { ChartSeries } from '@shared/watch/finding';

/** A fixed alert the watch is still checking: what it needs to judge the repair. */
export interface RepairToCheck {
  id: number;
  kind: string;
  subKind: string;
  zoneId: number | null;
  repairedAt: Date;
  evidence: Record<string, number>;
}

export interface Verdict {
  status: 'verified' | 'not-verified';
  decidedAtUtc: number;
  numbers: Record<string, number>;
  series: ChartSeries[];
  explanation: string;
}

const visible = `JOIN site s ON s.id = a.site_id LEFT JOIN site_share sh ON sh.site_id = s.id AND sh.organisation_id = ?
  WHERE (s.organisation_id = ? OR sh.organisation_id IS NOT NULL)`;

/**
 * How alerts were resolved and whether the data confirmed the repair, the officer's rule-breach rows and the
 * repair-time figures. Plain objects out.
 */
export class AlertRepairsRepository {
  constructor(private readonly db: DataSource) {}

  async resolve(
    em: EntityManager,
    id: number,
    r: {
      resolution: AlertResolution | null;
      repairedAt: Date;
      resolvedBy: number;
      resolverOrganisationId: number;
      watch: boolean;
    },
  ): Promise<void> {
    await em.query(
      `UPDATE alert SET status = 'resolved', resolved_at = ?, resolution = ?, repaired_at = ?, resolved_by = ?,
        resolver_organisation_id = ?, verification = ?, verified_at = NULL, verification_evidence = NULL WHERE id = ?`,
      [new Date(), r.resolution, r.repairedAt, r.resolvedBy, r.resolverOrganisationId, r.watch ? 'watching' : null, id],
    );
  }

  async verificationOf(id: number): Promise<{
    resolution: AlertResolution | null;
    repairedAt: string | null;
    verification: RepairVerificationDto | null;
  }> {
    const [row] = (await this.db.query(
      `SELECT resolution, repaired_at, verification, verified_at, verification_evidence FROM alert WHERE id = ?`,
      [id],
    )) as {
      resolution: AlertResolution | null;
      repaired_at: Date | null;
      verification: VerificationStatus | null;
      verified_at: Date | null;
      verification_evidence: string | null;
    }[];
    if (!row) return { resolution: null, repairedAt: null, verification: null };
    const ev = row.verification_evidence
      ? (JSON.parse(row.verification_evidence) as Pick<RepairVerificationDto, 'numbers' | 'series' | 'explanation'>)
      : { numbers: {}, series: [], explanation: null };
    return {
      resolution: row.resolution,
      repairedAt: row.repaired_at?.toISOString() ?? null,
      verification: row.verification
        ? { status: row.verification, decidedAt: row.verified_at?.toISOString() ?? null, ...ev }
        : null,
    };
  }

  /** Alerts of the site resolved as fixed whose repair the data has not settled yet. */
  async awaitingVerification(siteId: number): Promise<RepairToCheck[]> {
    const rows: {
      id: number;
      kind: string;
      sub_kind: string;
      zone_id: number | null;
      repaired_at: Date;
      evidence: string;
    }[] = await this.db.query(
      `SELECT id, kind, sub_kind, zone_id, repaired_at, evidence FROM alert
        WHERE verification = 'watching' AND site_id = ? AND status = 'resolved' AND repaired_at IS NOT NULL`,
      [siteId],
    );
    return rows.map((r) => ({
      id: r.id,
      kind: r.kind,
      subKind: r.sub_kind,
      zoneId: r.zone_id,
      repairedAt: r.repaired_at,
      evidence: (JSON.parse(r.evidence) as { numbers: Record<string, number> }).numbers,
    }));
  }

  /**
   * Records the data's verdict on a repair still being watched: verified, or not confirmed, which reopens the alert.
   * Returns false when the alert changed meanwhile (reopened by a finding, resolved again).
   */
  async recordVerdict(em: EntityManager, id: number, v: Verdict): Promise<boolean> {
    const evidence = JSON.stringify({ numbers: v.numbers, series: v.series, explanation: v.explanation });
    const reopen = v.status === 'not-verified';
    const result: { affectedRows: number } = await em.query(
      `UPDATE alert SET verification = ?, verified_at = ?, verification_evidence = ?
        ${reopen ? ", status = 'open', resolved_at = NULL, reopen_count = reopen_count + 1" : ''}
        WHERE id = ? AND verification = 'watching' AND status = 'resolved'`,
      [v.status, new Date(v.decidedAtUtc), evidence, id],
    );
    if (result.affectedRows === 0) return false;
    await em.query('INSERT INTO alert_event (alert_id, user_id, action, note, at) VALUES (?, NULL, ?, ?, ?)', [
      id,
      v.status,
      v.explanation.slice(0, 2000),
      new Date(),
    ]);
    return true;
  }

  /** A finding reopened a fixed alert still being watched: the repair is not confirmed. True when it was watched. */
  async markNotConfirmed(em: EntityManager, id: number, atUtc: number): Promise<boolean> {
    const note = 'The condition came back after the repair: the data does not confirm it.';
    const evidence = JSON.stringify({ numbers: {}, series: [], explanation: note });
    const result: { affectedRows: number } = await em.query(
      `UPDATE alert SET verification = 'not-verified', verified_at = ?, verification_evidence = ?
        WHERE id = ? AND verification = 'watching'`,
      [new Date(atUtc), evidence, id],
    );
    if (result.affectedRows === 0) return false;
    await em.query(
      "INSERT INTO alert_event (alert_id, user_id, action, note, at) VALUES (?, NULL, 'not-verified', ?, ?)",
      [id, note, new Date()],
    );
    return true;
  }

  /** Who resolved each alert as fixed, for the note that the repair did not hold. */
  async resolvers(
    ids: number[],
  ): Promise<{ alertId: number; siteName: string; email: string; name: string; userId: number }[]> {
    if (ids.length === 0) return [];
    const rows: { id: number; site_name: string; email: string; display_name: string; user_id: number }[] =
      await this.db.query(
        `SELECT a.id, s.name AS site_name, u.email, u.display_name, u.id AS user_id FROM alert a
          JOIN site s ON s.id = a.site_id JOIN \`user\` u ON u.id = a.resolved_by
          WHERE a.id IN (?) AND u.status = 'active'`,
        [ids],
      );
    return rows.map((r) => ({
      alertId: r.id,
      siteName: r.site_name,
      email: r.email,
      name: r.display_name,
      userId: r.user_id,
    }));
  }

  /** Fixed alerts first detected in [from, to), visible to the organisation, with who resolved them. */
  async repairs(
    viewerOrgId: number,
    from: Date,
    to: Date,
  ): Promise<
    {
      siteId: number;
      siteName: string;
      resolver: string;
      resolverOrg: string;
      verification: VerificationStatus | null;
      firstDetectedAt: Date;
      repairedAt: Date | null;
      verifiedAt: Date | null;
    }[]
  > {
    const rows: {
      site_id: number;
      site_name: string;
      resolver: string | null;
      resolver_org: string | null;
      verification: VerificationStatus | null;
      first_detected_at: Date;
      repaired_at: Date | null;
      verified_at: Date | null;
    }[] = await this.db.query(
      `SELECT a.site_id, s.name AS site_name, u.display_name AS resolver, o.name AS resolver_org, a.verification,
        a.first_detected_at, a.repaired_at, a.verified_at
        FROM alert a LEFT JOIN \`user\` u ON u.id = a.resolved_by
        LEFT JOIN organisation o ON o.id = a.resolver_organisation_id
        ${visible} AND a.resolution = 'fixed' AND a.first_detected_at >= ? AND a.first_detected_at < ?`,
      [viewerOrgId, viewerOrgId, from, to],
    );
    return rows.map((r) => ({
      siteId: r.site_id,
      siteName: r.site_name,
      resolver: r.resolver ?? 'Former user',
      resolverOrg: r.resolver_org ?? '—',
      verification: r.verification,
      firstDetectedAt: r.first_detected_at,
      repairedAt: r.repaired_at,
      verifiedAt: r.verified_at,
    }));
  }

  /** The watch's rule-breach alerts of a month on the given sites, as the officer's worklist rows. */
  async ruleBreaches(viewerOrgId: number, siteIds: number[], month: string): Promise<RuleWorklistRow[]> {
    if (siteIds.length === 0) return [];
    const rows: {
      id: number;
      site_id: number;
      site_name: string;
      status: string;
      severity: string;
      evidence: string;
    }[] = await this.db.query(
      `SELECT a.id, a.site_id, s.name AS site_name, a.status, a.severity, a.evidence FROM alert a ${visible}
          AND a.kind = 'watering-rules' AND a.site_id IN (?) AND a.condition_key LIKE ?
          ORDER BY s.name, a.id`,
      [viewerOrgId, viewerOrgId, siteIds, `%|${month}`],
    );
    return rows.map((r) => {
      const n = (JSON.parse(r.evidence) as { numbers: Record<string, number> }).numbers;
      return {
        siteId: r.site_id,
        siteName: r.site_name,
        month,
        alertId: r.id,
        status: r.status as RuleWorklistRow['status'],
        severity: r.severity as RuleWorklistRow['severity'],
        runsOutsideRules: n['runsOutsideRules'] ?? 0,
        manualRunsOutsideRules: n['manualRunsOutsideRules'] ?? 0,
        minutesOutsideRules: n['minutesOutsideRules'] ?? 0,
        notAWateringDay: n['notAWateringDay'] ?? 0,
        outsideAllowedHours: n['outsideAllowedHours'] ?? 0,
        overStationLimit: n['overStationLimit'] ?? 0,
        fromMeterOnly: n['fromMeterOnly'] ?? 0,
      };
    });
  }
}

export type { RepairTimeRow };
