import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  createSite,
  createWorld,
  signedIn,
  type Client,
  type TestApp,
  type World,
  createTestApp,
} from '../support/test-app';
import { addHours, addMeter, HOUR, runWatch } from './watch-fixtures';

let app: TestApp;
let world: World;
let admin: Client;
let contractor: Client;

beforeAll(async () => {
  app = await createTestApp();
  world = await createWorld(app.db);
  admin = await signedIn(app, world.users.admin.email);
  contractor = await signedIn(app, world.users.contractor.email);
});
afterAll(async () => app?.stop());

const JUNE = Date.parse('2026-06-01T07:00:00Z'); // 2026-06-01 00:00 in Los Angeles
const day = (n: number) => JUNE + (n - 1) * 24 * HOUR;
const recheck = (siteId: number, from: number, to: number) =>
  runWatch(admin, { from: new Date(from).toISOString(), to: new Date(to).toISOString(), siteIds: [siteId] });

/** A site whose meter reads 0 gal every hour of June 1–9, then flows 12 gal/h for 48 h (a leak) from June 10. */
async function leakInJune(): Promise<{ siteId: number; meterId: number; alertId: number }> {
  const site = await createSite(app.db, world.org.id);
  const meterId = await addMeter(app.db, site.id);
  await addHours(app.db, meterId, day(1), day(10), 0);
  await addHours(app.db, meterId, day(10), day(12), 12);
  await recheck(site.id, day(1), day(12));
  const [alert] = (await app.db.query("SELECT id FROM alert WHERE site_id = ? AND sub_kind = 'continuous-flow'", [
    site.id,
  ])) as { id: number }[];
  expect(alert).toBeDefined();
  return { siteId: site.id, meterId, alertId: alert!.id };
}

describe('repairs verified by the meter', () => {
  it(
    'when a leak is resolved as fixed and the next nights are back to the usual low, then the alert is marked ' +
      'verified by data with the nights as evidence, and the repair time counts for the site and the contractor',
    async () => {
      const { siteId, meterId, alertId } = await leakInJune();
      const resolved = await contractor
        .post(`/api/alerts/${alertId}/resolve`, {
          resolution: 'fixed',
          repairedOn: '2026-06-11',
          note: 'Lateral glued',
        })
        .expect(200);
      expect(resolved.body).toMatchObject({
        status: 'resolved',
        resolution: 'fixed',
        verification: { status: 'watching' },
      });
      expect(resolved.body.repairedAt).toBe('2026-06-12T07:00:00.000Z');

      // Two quiet nights are not enough yet.
      await addHours(app.db, meterId, day(12), day(14), 0);
      await recheck(siteId, day(12), day(14));
      expect((await admin.get(`/api/alerts/${alertId}`).expect(200)).body.verification.status).toBe('watching');

      await addHours(app.db, meterId, day(14), day(16), 0);
      await recheck(siteId, day(14), day(16));
      const verified = (await admin.get(`/api/alerts/${alertId}`).expect(200)).body;
      expect(verified).toMatchObject({ status: 'resolved', verification: { status: 'verified' } });
      expect(verified.verification.numbers).toMatchObject({ nightsAfterRepair: 3, medianNightLowGph: 0 });
      expect(verified.verification.series[0].points.length).toBeGreaterThanOrEqual(3);
      expect(verified.verification.explanation).toContain('confirms the repair');
      expect(verified.events.map((e: { action: string }) => e.action)).toContain('verified');

      const times = (await admin.get('/api/alerts/repair-times?from=2026-06-01&to=2026-06-30').expect(200)).body;
      const mine = times.bySite.find((r: { key: string }) => r.key === String(siteId));
      expect(mine).toMatchObject({ verified: 1, notVerified: 0, watching: 0 });
      expect(mine.medianDaysToVerified).toBeGreaterThan(mine.medianDaysToRepair);
      expect(times.byResolver.map((r: { label: string }) => r.label)).toContainEqual(
        expect.stringContaining('Test contractor'),
      );
    },
  );

  it(
    'when the leak goes on after the repair, then the alert reopens as not confirmed and whoever resolved it ' +
      'gets a note',
    async () => {
      const { siteId, meterId, alertId } = await leakInJune();
      await contractor
        .post(`/api/alerts/${alertId}/resolve`, { resolution: 'fixed', repairedOn: '2026-06-11' })
        .expect(200);
      await addHours(app.db, meterId, day(12), day(16), 12);
      await recheck(siteId, day(12), day(16));
      const alert = (await admin.get(`/api/alerts/${alertId}`).expect(200)).body;
      expect(alert).toMatchObject({ status: 'open', verification: { status: 'not-verified' } });
      expect(alert.events.map((e: { action: string }) => e.action)).toContain('not-verified');
      const mails: { subject: string }[] = await app.db.query(
        "SELECT subject FROM mail_message WHERE to_address = ? AND dedupe_key LIKE 'repair-not-confirmed:%'",
        [world.users.contractor.email],
      );
      expect(mails.map((m) => m.subject)).toContainEqual(expect.stringContaining('Repair not confirmed by data'));
    },
  );

  it(
    'when an alert is resolved without "fixed", or the repair day is in the future, ' + 'then nothing is watched',
    async () => {
      const { alertId } = await leakInJune();
      await contractor
        .post(`/api/alerts/${alertId}/resolve`, { resolution: 'fixed', repairedOn: '2099-01-01' })
        .expect(400);
      const plain = await contractor
        .post(`/api/alerts/${alertId}/resolve`, { resolution: 'not-a-problem' })
        .expect(200);
      expect(plain.body).toMatchObject({ status: 'resolved', resolution: 'not-a-problem', verification: null });
      const auditor = await signedIn(app, world.users.auditor.email);
      await auditor.post(`/api/alerts/${alertId}/resolve`, { resolution: 'fixed' }).expect(403);
    },
  );
});
