import type { DataSource } from 'typeorm';
import type { MailQueue } from '../../mail/domain/mail-queue';
import type { AlertMailRepository, MailAlertRow, RecipientRow } from '../data/alert-mail-repository';
import { digestMail, singleAlertMail, type MailAlert, type MailWarning } from './alert-digest';

export interface NotifyRequest {
  alerts: { alertId: number; reopened: boolean }[];
  /** The run's night (YYYY-MM-DD): one digest per user and night. */
  night: string;
  /** The run's per-site warnings (checks skipped or weakened); the digests carry those of each user's sites. */
  warnings: MailWarning[];
}

interface Reader {
  userId: number;
  email: string;
  name: string;
  frequency: RecipientRow['frequency'];
  sites: Set<number>;
  /** Sites of the user's own organisation where they may fix station data (admin, manager, contractor). */
  canFix: Set<number>;
  /** The organisations through which the user sees these sites (the outbox shows mail per organisation). */
  orgs: Set<number>;
}

/** Weather-station alerts go to the people who can upload or fetch the missing days, not to readers of the site. */
const FIXERS = new Set(['admin', 'manager', 'contractor']);

/**
 * After a run: one digest per user and night for the new and reopened alerts (and the run's warnings) of the sites
 * they follow, or one message per alert for users who chose "each". The dedupe keys make a rerun of the same night
 * queue nothing.
 */
export class AlertNotifier {
  constructor(
    private readonly db: DataSource,
    private readonly repo: AlertMailRepository,
    private readonly mailQueue: MailQueue,
    private readonly baseUrl: string,
  ) {}

  /** Returns how many messages were queued. */
  async notify(request: NotifyRequest): Promise<number> {
    const mailed = request.warnings.filter((w) => !w.setupOnly);
    if (request.alerts.length === 0 && mailed.length === 0) return 0;
    const reopened = new Map(request.alerts.map((a) => [a.alertId, a.reopened]));
    const alerts = (await this.repo.alerts([...reopened.keys()])).map((r) => ({
      ...r,
      reopened: reopened.get(r.id) ?? false,
    }));
    const siteIds = [...new Set([...alerts.map((a) => a.siteId), ...mailed.map((w) => w.siteId)])];
    const readers = readersOf(await this.repo.recipients(siteIds));
    let queued = 0;
    await this.db.transaction(async (em) => {
      for (const u of readers) {
        const mine = alerts.filter((a) => u.sites.has(a.siteId) && (a.kind !== 'weather' || u.canFix.has(a.siteId)));
        const warnings = mailed.filter((w) => u.sites.has(w.siteId));
        if (u.frequency === 'daily') {
          if (mine.length === 0 && warnings.length === 0) continue;
          const digest = digestMail({ to: u.email, name: u.name, alerts: mine, warnings, baseUrl: this.baseUrl });
          const mail = { ...digest, organisationIds: [...u.orgs] };
          if (await this.mailQueue.enqueue(em, mail, `watch-digest:${u.userId}:${request.night}`)) queued++;
          continue;
        }
        for (const a of mine) {
          const key = `watch-alert:${u.userId}:${a.id}:${a.reopened ? `reopened-${request.night}` : 'opened'}`;
          const mail = { ...singleAlertMail(u.email, u.name, a, this.baseUrl), organisationIds: [...u.orgs] };
          if (await this.mailQueue.enqueue(em, mail, key)) queued++;
        }
      }
    });
    if (queued > 0) this.mailQueue.kick();
    return queued;
  }
}

/** Recipients per user, keeping the sites each follows (all they can see unless they chose some). */
function readersOf(rows: readonly RecipientRow[]): Reader[] {
  const perUser = new Map<number, Reader>();
  for (const r of rows) {
    if (r.frequency === 'none') continue;
    if (r.siteIds && !r.siteIds.includes(r.siteId)) continue;
    const entry = perUser.get(r.userId) ?? {
      userId: r.userId,
      email: r.email,
      name: r.displayName,
      frequency: r.frequency,
      sites: new Set<number>(),
      canFix: new Set<number>(),
      orgs: new Set<number>(),
    };
    entry.sites.add(r.siteId);
    for (const id of r.organisationIds) entry.orgs.add(id);
    if (r.owner && FIXERS.has(r.role)) entry.canFix.add(r.siteId);
    perUser.set(r.userId, entry);
  }
  return [...perUser.values()];
}

export type { MailAlert, MailAlertRow };
