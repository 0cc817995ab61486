import type { DataSource } from 'typeorm';
import type { FindingKind, Severity } from '@shared/watch/finding';
import type { MailQueue } from '../../mail/domain/mail-queue';
import { digestMail, singleAlertMail, type MailAlert } from './alert-digest';

interface RecipientRow {
  user_id: number;
  email: string;
  display_name: string;
  site_id: number;
  frequency: 'each' | 'daily' | 'none';
  site_ids: string | null;
}

/**
 * After a run: one digest per user and night for the new and reopened alerts of the sites they follow, or one
 * message per alert for users who chose "each". The dedupe keys make a rerun of the same night queue nothing.
 */
export class AlertNotifier {
  constructor(
    private readonly db: DataSource,
    private readonly mailQueue: MailQueue,
    private readonly baseUrl: string,
  ) {}

  /** `night` names the run's night (YYYY-MM-DD); returns how many messages were queued. */
  async notify(alerts: { alertId: number; reopened: boolean }[], night: string): Promise<number> {
    if (alerts.length === 0) return 0;
    const reopened = new Map(alerts.map((a) => [a.alertId, a.reopened]));
    const rows: (Omit<MailAlert, 'reopened'> & { site_id: number })[] = (await this.db.query(
      `SELECT a.id, a.site_id, s.name AS siteName, s.time_zone AS timeZone, a.kind, a.sub_kind AS
        subKind, a.severity, a.period_start_utc AS periodStartUtc,
        a.water_lost_gal AS waterLostGal, a.money_lost AS moneyLost, a.currency, a.explanation
       FROM alert a JOIN site s ON s.id = a.site_id WHERE a.id IN (?) ORDER BY FIELD(a.severity,
        'act-now', 'act-soon', 'watch'), a.id`,
      [[...reopened.keys()]],
    )) as never;
    const mailAlerts = rows.map((r) => ({
      ...r,
      kind: r.kind as FindingKind,
      severity: r.severity as Severity,
      reopened: reopened.get(r.id) ?? false,
    }));
    const siteIds = [...new Set(rows.map((r) => r.site_id))];
    // Everyone active in the owning organisation or an organisation the site is shared with.
    const recipients: RecipientRow[] = await this.db.query(
      `SELECT DISTINCT u.id AS user_id, u.email, u.display_name, x.site_id, COALESCE(n.frequency,
        'daily') AS frequency, n.site_ids
       FROM (SELECT id AS site_id, organisation_id FROM site WHERE id IN (?) UNION SELECT site_id,
        organisation_id FROM site_share WHERE site_id IN (?)) x
       JOIN membership m ON m.organisation_id = x.organisation_id JOIN \`user\` u ON u.id =
        m.user_id AND u.status = 'active'
       LEFT JOIN user_notification n ON n.user_id = u.id ORDER BY u.id`,
      [siteIds, siteIds],
    );
    const perUser = new Map<
      number,
      { email: string; name: string; frequency: RecipientRow['frequency']; sites: Set<number> }
    >();
    for (const r of recipients) {
      if (r.frequency === 'none') continue;
      const followed = r.site_ids ? (JSON.parse(r.site_ids) as number[]) : null;
      if (followed && !followed.includes(r.site_id)) continue;
      const entry = perUser.get(r.user_id) ?? {
        email: r.email,
        name: r.display_name,
        frequency: r.frequency,
        sites: new Set<number>(),
      };
      entry.sites.add(r.site_id);
      perUser.set(r.user_id, entry);
    }
    let queued = 0;
    await this.db.transaction(async (em) => {
      for (const [userId, u] of perUser) {
        const mine = mailAlerts.filter((a) => u.sites.has((a as unknown as { site_id: number }).site_id));
        if (mine.length === 0) continue;
        if (u.frequency === 'daily') {
          if (
            await this.mailQueue.enqueue(
              em,
              digestMail(u.email, u.name, mine, this.baseUrl),
              `watch-digest:${userId}:${night}`,
            )
          )
            queued++;
        } else {
          for (const a of mine) {
            const key = `watch-alert:${userId}:${a.id}:${a.reopened ? `reopened-${night}` : 'opened'}`;
            if (await this.mailQueue.enqueue(em, singleAlertMail(u.email, u.name, a, this.baseUrl), key)) queued++;
          }
        }
      }
    });
    if (queued > 0) this.mailQueue.kick();
    return queued;
  }
}
