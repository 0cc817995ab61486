import type { DataSource } from 'typeorm';
import { addressNumberOf } from '@shared/watering-rules/watering-rule';
import { localMidnightUtc, nextDate } from '@shared/watch/site-clock';
import { createApp } from '../../backend/src/app';
import type { Config } from '../../backend/src/config';
import { createSmtpMailer } from '../../backend/src/platform/mail/mailer';
import { DEMO_ORGANISATIONS, DEMO_USERS } from './demo-scenario';

const orgName = (key: string) => DEMO_ORGANISATIONS.find((o) => o.key === key)!.name;

/** The water agency's demo rule: no watering in daytime, an hour per station at most, from June 2026 on. */
export const DEMO_RULE = {
  name: 'Verdella summer watering rule',
  stage: 'Stage 2 — water shortage',
  site: 'Tannery Point Office Park',
};

/**
 * The agency's watering rule, with Tannery Point under it (its November long run breaks it). Idempotent by
 * organisation, name and stage. Runs before seedAlerts, which files the breach.
 */
export async function seedWateringRules(db: DataSource): Promise<number> {
  const [agency] = (await db.query('SELECT id FROM organisation WHERE name = ?', [orgName('verdella')])) as {
    id: number;
  }[];
  const [existing] = (await db.query(
    'SELECT id FROM watering_rule WHERE organisation_id = ? AND name = ? AND stage = ?',
    [agency!.id, DEMO_RULE.name, DEMO_RULE.stage],
  )) as { id: number }[];
  if (existing) return 0;
  const [site] = (await db.query('SELECT id, address FROM site WHERE name = ?', [DEMO_RULE.site])) as {
    id: number;
    address: string;
  }[];
  const r: { insertId: number } = await db.query(
    `INSERT INTO watering_rule (organisation_id, name, stage, day_mode, weekdays, start_hour, end_hour,
      max_station_minutes, in_force_from, in_force_to) VALUES (?, ?, ?, 'any', '', 20, 6, 60, '2026-06-01', NULL)`,
    [agency!.id, DEMO_RULE.name, DEMO_RULE.stage],
  );
  await db.query('INSERT INTO watering_rule_site (rule_id, site_id, address_number) VALUES (?, ?, ?)', [
    r.insertId,
    site!.id,
    addressNumberOf(site!.address),
  ]);
  return 1;
}

/**
 * The Juniper Hollow leak (Nov 10–14), resolved as fixed on Nov 14 by the managers' contractor crew, then the watch
 * re-checks the nights after: the meter is back to its usual night low, so the repair shows "verified by data".
 * Runs after seedAlerts; idempotent (an alert already resolved is left alone).
 */
export async function seedVerifiedRepair(db: DataSource, config: Config): Promise<number> {
  const [alert] = (await db.query(
    `SELECT a.id, s.time_zone FROM alert a JOIN site s ON s.id = a.site_id WHERE s.name = ? AND a.kind = 'leak'
      AND a.resolution IS NULL AND a.status <> 'resolved' ORDER BY a.period_start_utc LIMIT 1`,
    ['Juniper Hollow Elementary Fields'],
  )) as { id: number; time_zone: string }[];
  if (!alert) return 0;
  const manager = DEMO_USERS.find((u) => u.organisation === 'cobalt' && u.role === 'manager')!;
  const [user] = (await db.query('SELECT id FROM `user` WHERE email = ?', [manager.email])) as { id: number }[];
  const [org] = (await db.query('SELECT id FROM organisation WHERE name = ?', [orgName('cobalt')])) as {
    id: number;
  }[];
  const repairedAt = new Date(localMidnightUtc(nextDate('2026-11-14'), alert.time_zone));
  await db.transaction(async (em) => {
    await em.query(
      `UPDATE alert SET status = 'resolved', resolved_at = ?, resolution = 'fixed', repaired_at = ?, resolved_by = ?,
        resolver_organisation_id = ?, verification = 'watching' WHERE id = ?`,
      [repairedAt, repairedAt, user!.id, org!.id, alert.id],
    );
    await em.query("INSERT INTO alert_event (alert_id, user_id, action, note, at) VALUES (?, ?, 'resolved', ?, ?)", [
      alert.id,
      user!.id,
      'Cracked lateral under the B field replaced.',
      repairedAt,
    ]);
  });
  const mailer = createSmtpMailer(config.mail);
  const { watch, close } = createApp({ config, db, mailer });
  try {
    await watch.service.run({
      trigger: 'recheck',
      organisationId: null,
      requestedBy: null,
      fromUtc: new Date('2026-11-10T00:00:00Z'),
      toUtc: new Date(),
      siteIds: [
        ((await db.query('SELECT site_id FROM alert WHERE id = ?', [alert.id])) as { site_id: number }[])[0]!.site_id,
      ],
    });
  } finally {
    await close();
    mailer.close();
  }
  return 1;
}
