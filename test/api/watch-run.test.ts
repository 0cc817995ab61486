import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JobLease } from '../../backend/src/jobs/job-lease';
import { WATCH_LEASE_NAME } from '../../backend/src/components/watch/watch-module';
import {
  createSite,
  createWorld,
  signedIn,
  type Client,
  type TestApp,
  type World,
  createTestApp,
} from '../support/test-app';
import { addHours, alertCount, HOUR, leakingSite, runWatch, thisHour } from './watch-fixtures';

let app: TestApp;
let world: World;
let admin: Client;

beforeAll(async () => {
  app = await createTestApp();
  world = await createWorld(app.db);
  admin = await signedIn(app, world.users.admin.email);
});
afterAll(async () => app?.stop());

describe('the nightly watch run', () => {
  it(
    'when the same night is run twice, then the second run adds no ' + 'alerts and an unchanged site is skipped',
    async () => {
      const site = await createSite(app.db, world.org.id);
      await leakingSite(app.db, site.id);
      const first = await runWatch(admin);
      expect(first.errors).toEqual([]);
      const raised = await alertCount(app, site.id);
      expect(raised).toBeGreaterThanOrEqual(1);
      const kinds: { kind: string; sub_kind: string }[] = await app.db.query(
        'SELECT kind, sub_kind FROM alert WHERE site_id = ?',
        [site.id],
      );
      expect(kinds).toContainEqual({ kind: 'leak', sub_kind: 'continuous-flow' });

      const second = await runWatch(admin);
      expect(second.alertsRaised).toBe(0);
      expect(await alertCount(app, site.id)).toBe(raised);
      // A re-check of the same range files the same findings again: still no new alert.
      const recheck = await runWatch(admin, {
        from: new Date(thisHour() - 3 * 86_400_000).toISOString(),
        to: new Date().toISOString(),
      });
      expect(recheck.sitesChecked).toBeGreaterThanOrEqual(1);
      expect(recheck.alertsRaised).toBe(0);
      expect(await alertCount(app, site.id)).toBe(raised);
    },
  );

  it(
    'when a site has no new data since the last run, then the incremental ' + 'run skips it; new data brings it back',
    async () => {
      const org = await createWorld(app.db);
      const orgAdmin = await signedIn(app, org.users.admin.email);
      const site = await createSite(app.db, org.org.id);
      const meterId = await leakingSite(app.db, site.id, 30, 2);
      const first = await runWatch(orgAdmin);
      expect(first).toMatchObject({ sitesChecked: 1, sitesSkipped: 0 });
      const second = await runWatch(orgAdmin);
      expect(second).toMatchObject({ sitesChecked: 0, sitesSkipped: 1, alertsRaised: 0 });
      await addHours(app.db, meterId, thisHour() - 2 * HOUR, thisHour(), 12);
      const third = await runWatch(orgAdmin);
      expect(third).toMatchObject({ sitesChecked: 1, sitesSkipped: 0, alertsRaised: 0 });
      expect(third.alertsUpdated).toBeGreaterThanOrEqual(1);
      const [alert] = (await app.db.query(
        "SELECT period_end_utc FROM alert WHERE site_id = ? AND sub_kind = 'continuous-flow'",
        [site.id],
      )) as { period_end_utc: Date }[];
      expect(alert!.period_end_utc.getTime()).toBe(thisHour());
    },
  );

  it('when a resolved leak comes back in newer data, then the same alert reopens instead of a new one', async () => {
    const site = await createSite(app.db, world.org.id);
    const meterId = await leakingSite(app.db, site.id, 36, 6);
    await runWatch(admin);
    const [alert] = (await app.db.query("SELECT id FROM alert WHERE site_id = ? AND sub_kind = 'continuous-flow'", [
      site.id,
    ])) as { id: number }[];
    await admin.post(`/api/alerts/${alert!.id}/resolve`, { note: 'Replaced the cracked lateral.' }).expect(200);
    const before = await alertCount(app, site.id);

    await addHours(app.db, meterId, thisHour() - 6 * HOUR, thisHour(), 12);
    const run = await runWatch(admin);
    expect(run.alertsReopened).toBeGreaterThanOrEqual(1);
    expect(await alertCount(app, site.id)).toBe(before);
    const detail = (await admin.get(`/api/alerts/${alert!.id}`).expect(200)).body;
    expect(detail).toMatchObject({ status: 'open', reopenCount: 1 });
    expect(detail.events.map((e: { action: string }) => e.action)).toEqual(['opened', 'resolved', 'reopened']);
  });

  it(
    'when one site fails, then the others are still checked and the ' + 'run records the failure for that site',
    async () => {
      const org = await createWorld(app.db);
      const orgAdmin = await signedIn(app, org.users.admin.email);
      const bad = await createSite(app.db, org.org.id);
      const good = await createSite(app.db, org.org.id);
      await leakingSite(app.db, bad.id);
      await leakingSite(app.db, good.id);
      // Written behind the API's back, as a corrupt row would be: a negative threshold makes the detectors refuse the
      // site.
      await app.db.query(
        `INSERT INTO site_watch_settings (site_id, thresholds, irrigation_start_hour,
        irrigation_end_hour) VALUES (?, '{"silentHours":-5}', 21, 7)`,
        [bad.id],
      );
      const run = await runWatch(orgAdmin);
      expect(run.sitesChecked).toBe(1);
      expect(run.errors).toEqual([
        expect.objectContaining({ siteId: bad.id, message: expect.stringContaining('silentHours') }),
      ]);
      expect(await alertCount(app, good.id)).toBeGreaterThanOrEqual(1);
      expect(await alertCount(app, bad.id)).toBe(0);
      const history = (await orgAdmin.get('/api/watch/runs').expect(200)).body;
      expect(history.items[0]).toMatchObject({
        trigger: 'manual',
        status: 'done',
        errors: [expect.objectContaining({ siteId: bad.id })],
      });
    },
  );

  it('when another instance holds the watch lease, then "run now" is refused until it is released', async () => {
    const other = new JobLease(app.db, WATCH_LEASE_NAME, 'another-instance');
    for (let i = 0; i < 100 && !(await other.tryAcquire(60_000)); i++) await new Promise((r) => setTimeout(r, 200));
    try {
      const res = await admin.post('/api/watch/runs', {});
      expect(res.status).toBe(409);
    } finally {
      await other.release();
    }
    await runWatch(admin);
  });

  it('when someone who is not an administrator asks for runs, then it is forbidden', async () => {
    const manager = await signedIn(app, world.users.manager.email);
    await manager.post('/api/watch/runs', {}).expect(403);
    await manager.get('/api/watch/runs').expect(403);
    await admin.post('/api/watch/runs', { to: new Date().toISOString() }).expect(400);
  });
});
