import type { DataSource } from 'typeorm';
import { createApp } from '../../backend/src/app';
import type { Config } from '../../backend/src/config';
import { createSmtpMailer } from '../../backend/src/platform/mail/mailer';
import { seedWatchSettings } from './demo-watch-settings';

/** The seeded months start here; the demo re-check reads them all once. */
const DEMO_FROM = '2026-09-01T00:00:00.000Z';

/**
 * Runs the nightly watch over the seeded demo data so the inbox, the dashboards and the development outbox show
 * believable alerts. Idempotent: alerts are filed by finding key and digests deduplicated per user and night, so
 * a second seed adds nothing.
 */
export async function seedAlerts(
  db: DataSource,
  config: Config,
): Promise<{ alerts: number; byKind: Record<string, number>; mails: number }> {
  await seedWatchSettings(db);
  const mailer = createSmtpMailer(config.mail);
  const { watch, mailQueue, close } = createApp({ config, db, mailer });
  try {
    const recheck = await watch.service.run({
      trigger: 'recheck',
      organisationId: null,
      requestedBy: null,
      fromUtc: new Date(DEMO_FROM),
      toUtc: new Date(),
    });
    if (!recheck) throw new Error('the watch is running elsewhere; seed again when it has finished');
    // A normal incremental run records where each site was left, so the next night reads only new data.
    const night = await watch.service.run({ trigger: 'manual', organisationId: null, requestedBy: null });
    await mailQueue.deliverDue().catch(() => undefined);
    const rows: { kind: string; n: string }[] = await db.query('SELECT kind, COUNT(*) AS n FROM alert GROUP BY kind');
    const byKind = Object.fromEntries(rows.map((r) => [r.kind, Number(r.n)]));
    return {
      alerts: rows.reduce((s, r) => s + Number(r.n), 0),
      byKind,
      mails: recheck.mailsQueued + (night?.mailsQueued ?? 0),
    };
  } finally {
    await close();
    mailer.close();
  }
}
