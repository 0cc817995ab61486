import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { equipSite, siteReadings, SAMPLES } from '../support/ingest-fixtures';
import {
  createSite,
  createTestApp,
  createWorld,
  signedIn,
  TEST_PASSWORD,
  type Client,
  type TestApp,
  type World,
} from '../support/test-app';

let app: TestApp;
let world: World;
let admin: Client;

beforeAll(async () => {
  app = await createTestApp();
  world = await createWorld(app.db);
  admin = await signedIn(app, world.users.admin.email);
});
afterAll(async () => app?.stop());

describe('CSRF and API keys (finding 6)', () => {
  it(
    'when a sign-in carries a made-up bearer key and no CSRF token, ' + 'then it is refused and no session starts',
    async () => {
      const res = await request(app.server.url)
        .post('/api/auth/sign-in')
        .set('Authorization', 'Bearer rk_made_up_0000')
        .send({ email: world.users.manager.email, password: TEST_PASSWORD });
      expect([401, 403]).toContain(res.status);
      expect(res.headers['set-cookie'] ?? []).not.toEqual(
        expect.arrayContaining([expect.stringMatching(/^rillmark\.sid=/)]),
      );
    },
  );

  it(
    'when a signed-in browser is made to sign out with a bearer header and no CSRF token, ' + 'then it stays signed in',
    async () => {
      const manager = await signedIn(app, world.users.manager.email);
      const res = await manager.agent.post('/api/auth/sign-out').set('Authorization', 'Bearer rk_made_up_0000');
      expect([401, 403]).toContain(res.status);
      await manager.get('/api/auth/me').expect(200);
    },
  );

  it('when a valid API key is sent to a sign-in route, then it is refused: keys only send uploads', async () => {
    const site = await createSite(app.db, world.org.id);
    const key = (await admin.post('/api/api-keys', { name: 'Logger', siteIds: [site.id] }).expect(201)).body;
    const res = await request(app.server.url)
      .post('/api/auth/sign-in')
      .set('Authorization', `Bearer ${key.secret}`)
      .send({ email: world.users.manager.email, password: TEST_PASSWORD });
    expect(res.status).toBe(403);
  });

  it(
    'when a signed-in browser posts with a bearer header but no token to an ordinary route, ' +
      'then CSRF still applies',
    async () => {
      const manager = await signedIn(app, world.users.manager.email);
      const res = await manager.agent
        .post('/api/sites')
        .set('Authorization', 'Bearer rk_made_up_0000')
        .send({ name: 'Sneaky', kind: 'park', address: 'x', timeZone: 'UTC' });
      expect([401, 403]).toContain(res.status);
      expect((await manager.get('/api/sites?q=Sneaky').expect(200)).body.total).toBe(0);
    },
  );

  it(
    'when a valid API key sends an upload without any CSRF token, ' + 'then it is accepted (the key authenticated it)',
    async () => {
      const site = await createSite(app.db, world.org.id);
      await equipSite(admin, site.id);
      const key = (await admin.post('/api/api-keys', { name: 'Nightly', siteIds: [site.id] }).expect(201)).body;
      await request(app.server.url)
        .post(`/api/sites/${site.id}/uploads`)
        .set('Authorization', `Bearer ${key.secret}`)
        .attach('file', `${SAMPLES}/meters/interval-long-hourly.csv`)
        .expect(201);
      expect((await siteReadings(app.db, site.id)).length).toBe(98);
    },
  );
});
