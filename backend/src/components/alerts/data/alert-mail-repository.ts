import type { DataSource } from 'typeorm';
import type { FindingKind, Severity } from '@shared/watch/finding';
import type { NotificationFrequency, NotificationPreferenceDto } from '@shared/alerts/alert-dto';
import type { Role } from '@shared/auth/roles';

/** An alert as the e-mail tells it. */
export interface MailAlertRow {
  id: number;
  siteId: number;
  siteName: string;
  timeZone: string;
  kind: FindingKind;
  subKind: string;
  severity: Severity;
  periodStartUtc: Date;
  waterLostGal: number | null;
  moneyLost: number | null;
  currency: string | null;
  explanation: string;
}

/** A user who may hear about a site, with their e-mail choice. */
export interface RecipientRow {
  userId: number;
  email: string;
  displayName: string;
  siteId: number;
  role: Role;
  /** True when the user belongs to the site's owning organisation (not a share). */
  owner: boolean;
  /** The organisations through which the user sees the site (owner, or ones it is shared with). */
  organisationIds: number[];
  frequency: NotificationFrequency;
  siteIds: number[] | null;
}

/** The reads alert e-mail needs, and each user's e-mail preference. */
export class AlertMailRepository {
  constructor(private readonly db: DataSource) {}

  /** The alerts, most urgent first. */
  async alerts(ids: number[]): Promise<MailAlertRow[]> {
    if (ids.length === 0) return [];
    const rows: (Omit<MailAlertRow, 'moneyLost'> & { moneyLost: number | string | null })[] = await this.db.query(
      `SELECT a.id, a.site_id AS siteId, s.name AS siteName, s.time_zone AS timeZone, a.kind, a.sub_kind AS
        subKind, a.severity, a.period_start_utc AS periodStartUtc,
        a.water_lost_gal AS waterLostGal, a.money_lost AS moneyLost, a.currency, a.explanation
       FROM alert a JOIN site s ON s.id = a.site_id WHERE a.id IN (?) ORDER BY FIELD(a.severity,
        'act-now', 'act-soon', 'watch'), a.id`,
      [ids],
    );
    return rows.map((r) => ({ ...r, moneyLost: r.moneyLost === null ? null : Number(r.moneyLost) }));
  }

  /** Everyone active in the owning organisation or an organisation the site is shared with. */
  async recipients(siteIds: number[]): Promise<RecipientRow[]> {
    if (siteIds.length === 0) return [];
    const rows: {
      user_id: number;
      email: string;
      display_name: string;
      site_id: number;
      role: Role;
      owner: number | string;
      organisation_ids: string;
      frequency: NotificationFrequency;
      site_ids: string | null;
    }[] = await this.db.query(
      `SELECT u.id AS user_id, u.email, u.display_name, x.site_id, m.role, MAX(x.owner) AS owner,
        GROUP_CONCAT(DISTINCT x.organisation_id) AS organisation_ids,
        COALESCE(n.frequency, 'daily') AS frequency, n.site_ids
       FROM (SELECT id AS site_id, organisation_id, 1 AS owner FROM site WHERE id IN (?) UNION SELECT site_id,
        organisation_id, 0 AS owner FROM site_share WHERE site_id IN (?)) x
       JOIN membership m ON m.organisation_id = x.organisation_id JOIN \`user\` u ON u.id =
        m.user_id AND u.status = 'active'
       LEFT JOIN user_notification n ON n.user_id = u.id
       GROUP BY u.id, u.email, u.display_name, x.site_id, m.role, n.frequency, n.site_ids ORDER BY u.id`,
      [siteIds, siteIds],
    );
    return rows.map((r) => ({
      userId: r.user_id,
      email: r.email,
      displayName: r.display_name,
      siteId: r.site_id,
      role: r.role,
      owner: Number(r.owner) === 1,
      organisationIds: r.organisation_ids.split(',').map(Number),
      frequency: r.frequency,
      siteIds: r.site_ids ? (JSON.parse(r.site_ids) as number[]) : null,
    }));
  }

  async preference(userId: number): Promise<NotificationPreferenceDto> {
    const [row] = (await this.db.query('SELECT frequency, site_ids FROM user_notification WHERE user_id = ?', [
      userId,
    ])) as { frequency: NotificationFrequency; site_ids: string | null }[];
    return {
      frequency: row?.frequency ?? 'daily',
      siteIds: row?.site_ids ? (JSON.parse(row.site_ids) as number[]) : null,
    };
  }

  async savePreference(userId: number, pref: NotificationPreferenceDto): Promise<void> {
    const siteIds = pref.siteIds ? JSON.stringify([...new Set(pref.siteIds)]) : null;
    await this.db.query(
      `INSERT INTO user_notification (user_id, frequency, site_ids) VALUES (?, ?, ?)
       ON DUPLICATE KEY UPDATE frequency = VALUES(frequency), site_ids = VALUES(site_ids)`,
      [userId, pref.frequency, siteIds],
    );
  }
}
