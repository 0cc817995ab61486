import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { equipSite, siteReadings, uploadFile, SAMPLES } from '../support/ingest-fixtures';
import {
  createSite,
  createTestApp,
  createWorld,
  shareSite,
  signedIn,
  type Client,
  type TestApp,
  type World,
} from '../support/test-app';

let app: TestApp;
let world: World;
let other: World;
let admin: Client;
let manager: Client;

beforeAll(async () => {
  // A 1 MB limit so the over-the-limit case stays small.
  app = await createTestApp({ RILLMARK_UPLOAD_MAX_MB: '1' });
  world = await createWorld(app.db);
  other = await createWorld(app.db, 'contractor');
  admin = await signedIn(app, world.users.admin.email);
  manager = await signedIn(app, world.users.manager.email);
});
afterAll(async () => app?.stop());

async function equippedSite(): Promise<number> {
  const site = await createSite(app.db, world.org.id);
  await equipSite(manager, site.id);
  return site.id;
}

describe('who may upload', () => {
  it('when an auditor uploads, then it is forbidden and nothing is stored', async () => {
    const siteId = await equippedSite();
    const auditor = await signedIn(app, world.users.auditor.email);
    const res = await uploadFile(auditor, siteId, 'meters/interval-long-hourly.csv').expect(403);
    expect(res.body.error.message).toMatch(/this needs "contribute"/);
    expect(await siteReadings(app.db, siteId)).toEqual([]);
    expect((await manager.get(`/api/sites/${siteId}/uploads`).expect(200)).body.total).toBe(0);
  });

  it('when another organisation uploads to a site it cannot see, then the site is not found', async () => {
    const siteId = await equippedSite();
    const stranger = await signedIn(app, other.users.manager.email);
    await uploadFile(stranger, siteId, 'meters/interval-long-hourly.csv').expect(404);
    await stranger.get(`/api/sites/${siteId}/meters`).expect(404);
  });

  it('when a contractor organisation has the site shared with contribute, then its contractor can upload', async () => {
    const siteId = await equippedSite();
    await shareSite(app.db, siteId, other.org.id, 'contribute');
    const contractor = await signedIn(app, other.users.contractor.email);
    await uploadFile(contractor, siteId, 'meters/interval-long-hourly.csv').expect(201);
  });

  it('when an upload is sent without the CSRF header from a browser session, then it is refused', async () => {
    const siteId = await equippedSite();
    await manager.agent
      .post(`/api/sites/${siteId}/uploads`)
      .attach('file', `${SAMPLES}/meters/interval-long-hourly.csv`)
      .expect(403);
  });
});

describe('size limit', () => {
  it(
    'when a file is over RILLMARK_UPLOAD_MAX_MB, then it is refused ' +
      'with 413 naming the limit, and nothing is stored',
    async () => {
      const siteId = await equippedSite();
      const row = 'SCHOOL-01,2026-11-20 00:00,1.00\n';
      const big = Buffer.from(
        'Meter #,Interval Start,Usage (Gal)\n' + row.repeat(Math.ceil((1.2 * 1024 * 1024) / row.length)),
      );
      const res = await uploadFile(
        manager,
        siteId,
        big,
        { overrides: JSON.stringify({ intervalMinutes: 60 }) },
        'big.csv',
      );
      expect(res.status, JSON.stringify(res.body)).toBe(413);
      expect(res.body.error.message).toMatch(/upload limit of 1 MB \(RILLMARK_UPLOAD_MAX_MB\)/);
      expect(await siteReadings(app.db, siteId)).toEqual([]);
    },
  );

  it('when the declared length is far over the limit, then it is refused before the file is read', async () => {
    const siteId = await equippedSite();
    const big = Buffer.alloc(3 * 1024 * 1024, 'a');
    const res = await uploadFile(manager, siteId, big, {}, 'huge.csv').expect(413);
    expect(res.body.error.code).toBe('payload_too_large');
    expect((await manager.get(`/api/sites/${siteId}/uploads`).expect(200)).body.total).toBe(0);
  });
});

describe('API keys', () => {
  async function newKey(siteIds: number[]): Promise<{ id: number; secret: string }> {
    const res = await admin.post('/api/api-keys', { name: `Nightly ${siteIds.join('-')}`, siteIds }).expect(201);
    expect(res.body.secret).toMatch(/^rk_[0-9a-f]{8}_[A-Za-z0-9_-]{43}$/);
    return res.body;
  }
  const machine = (siteId: number, secret: string) =>
    request(app.server.url)
      .post(`/api/sites/${siteId}/uploads`)
      .set('Authorization', `Bearer ${secret}`)
      .attach('file', `${SAMPLES}/meters/interval-long-hourly.csv`);

  it(
    'when a script uploads with a key, then the upload is stored ' + 'under the key and its status can be read',
    async () => {
      const siteId = await equippedSite();
      const key = await newKey([siteId]);
      const res = await machine(siteId, key.secret).expect(201);
      expect(res.body.upload).toMatchObject({ accepted: 98, viaApiKey: `Nightly ${siteId}` });
      await request(app.server.url)
        .get(`/api/uploads/${res.body.upload.id}`)
        .set('Authorization', `Bearer ${key.secret}`)
        .expect(200);
      const listed = (await admin.get('/api/api-keys').expect(200)).body.find((k: { id: number }) => k.id === key.id);
      expect(listed).toMatchObject({ siteIds: [siteId], revokedAt: null, lastUsedAt: expect.any(String) });
      expect(listed.secret).toBeUndefined();
      const [stored] = await app.db.query('SELECT secret_hash FROM api_key WHERE id = ?', [key.id]);
      expect(stored.secret_hash).not.toContain(key.secret.slice(12));
    },
  );

  it('when a key is revoked, then it gets 401', async () => {
    const siteId = await equippedSite();
    const key = await newKey([siteId]);
    await admin.delete(`/api/api-keys/${key.id}`).expect(204);
    const res = await machine(siteId, key.secret).expect(401);
    expect(res.body.error.message).toMatch(/not valid or has been revoked/);
    await machine(siteId, key.secret.slice(0, -1) + (key.secret.endsWith('A') ? 'B' : 'A')).expect(401);
  });

  it('when a key is used on a site outside its scope, or for anything but uploads, then it is refused', async () => {
    const mine = await equippedSite();
    const another = await equippedSite();
    const key = await newKey([mine]);
    await machine(another, key.secret).expect(404);
    expect(await siteReadings(app.db, another)).toEqual([]);
    await request(app.server.url).get('/api/sites').set('Authorization', `Bearer ${key.secret}`).expect(403);
    await request(app.server.url)
      .post(`/api/uploads/1/rollback`)
      .set('Authorization', `Bearer ${key.secret}`)
      .expect(403);
  });

  it('when a manager tries to make a key, then only administrators may', async () => {
    const siteId = await equippedSite();
    await manager.post('/api/api-keys', { name: 'Mine', siteIds: [siteId] }).expect(403);
    const foreign = await createSite(app.db, other.org.id);
    await admin.post('/api/api-keys', { name: 'Theirs', siteIds: [foreign.id] }).expect(404);
  });
});
