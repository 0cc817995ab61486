import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSite, createTestApp, createWorld, signedIn, type TestApp } from '../support/test-app';
import { addMeter, addHours, HOUR, leakingSite, runWatch, thisHour } from './watch-fixtures';

let app: TestApp;

beforeAll(async () => {
  app = await createTestApp();
});
afterAll(async () => app?.stop());

async function queuedFor(
  email: string,
): Promise<{ subject: string; body_text: string; body_html: string | null; dedupe_key: string }[]> {
  return app.db.query(
    'SELECT subject, body_text, body_html, dedupe_key FROM mail_message WHERE to_address = ? ORDER BY id',
    [email],
  );
}

describe('watch e-mail', () => {
  it(
    'when a run raises alerts, then each user gets what they chose: ' +
      'one digest, one mail per alert, or nothing, once per night',
    async () => {
      const world = await createWorld(app.db);
      const admin = await signedIn(app, world.users.admin.email);
      const site = await createSite(app.db, world.org.id, { name: `Quail Hollow Commons ${Date.now()}` });
      const quiet = await createSite(app.db, world.org.id);
      await leakingSite(app.db, site.id);
      await (
        await signedIn(app, world.users.manager.email)
      )
        .put('/api/me/notifications', { frequency: 'none', siteIds: null })
        .expect(200);
      await (
        await signedIn(app, world.users.contractor.email)
      )
        .put('/api/me/notifications', { frequency: 'each', siteIds: null })
        .expect(200);
      const auditor = await signedIn(app, world.users.auditor.email);
      // The auditor follows only the quiet site, so the leak is not theirs to hear about.
      expect(
        (await auditor.put('/api/me/notifications', { frequency: 'daily', siteIds: [quiet.id] }).expect(200)).body,
      ).toEqual({ frequency: 'daily', siteIds: [quiet.id] });
      expect((await admin.get('/api/me/notifications').expect(200)).body).toEqual({
        frequency: 'daily',
        siteIds: null,
      });

      const run = await runWatch(admin);
      const alerts = Number(
        ((await app.db.query('SELECT COUNT(*) AS n FROM alert WHERE site_id = ?', [site.id])) as [{ n: string }])[0].n,
      );
      expect(alerts).toBeGreaterThanOrEqual(1);

      const digest = await queuedFor(world.users.admin.email);
      expect(digest).toHaveLength(1);
      expect(digest[0]!.subject).toMatch(/nightly watch/);
      expect(digest[0]!.body_text).toContain(site.name);
      expect(digest[0]!.body_text).toMatch(/gal lost so far/);
      expect(digest[0]!.body_html).toContain('<ul>');
      expect(await queuedFor(world.users.manager.email)).toHaveLength(0);
      expect(await queuedFor(world.users.auditor.email)).toHaveLength(0);
      expect(await queuedFor(world.users.contractor.email)).toHaveLength(alerts);
      expect(run.mailsQueued).toBe(1 + alerts);

      // A new alert later the same night: the digest for this night is already queued, so nothing more.
      const meterId = await addMeter(app.db, quiet.id);
      await addHours(app.db, meterId, thisHour() - 40 * HOUR, thisHour(), 9);
      const again = await runWatch(admin);
      expect(again.alertsRaised).toBeGreaterThanOrEqual(1);
      expect(await queuedFor(world.users.admin.email)).toHaveLength(1);
      expect((await queuedFor(world.users.auditor.email)).map((m) => m.dedupe_key)).toEqual([
        expect.stringMatching(/^watch-digest:/),
      ]);
    },
  );

  it('when a preference names a site the user cannot see, then it is refused', async () => {
    const world = await createWorld(app.db);
    const other = await createWorld(app.db);
    const hidden = await createSite(app.db, other.org.id);
    const manager = await signedIn(app, world.users.manager.email);
    await manager.put('/api/me/notifications', { frequency: 'each', siteIds: [hidden.id] }).expect(404);
    await manager.put('/api/me/notifications', { frequency: 'hourly', siteIds: null }).expect(400);
  });
});
