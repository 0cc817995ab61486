import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import {
  createSite,
  createTestApp,
  createWorld,
  signedIn,
  type Client,
  type TestApp,
  type World,
} from '../support/test-app';

/** The API-key list behind the settings page: administrators only, and never across organisations. */
let app: TestApp;
let world: World;
let other: World;
let admin: Client;
let otherAdmin: Client;

beforeAll(async () => {
  app = await createTestApp();
  world = await createWorld(app.db);
  other = await createWorld(app.db);
  admin = await signedIn(app, world.users.admin.email);
  otherAdmin = await signedIn(app, other.users.admin.email);
});
afterAll(async () => app?.stop());

async function newKey(): Promise<{ id: number; secret: string; name: string }> {
  const site = await createSite(app.db, world.org.id);
  return (await admin.post('/api/api-keys', { name: `Logger ${site.id}`, siteIds: [site.id] }).expect(201)).body;
}

/** 404 means the key was accepted and the (missing) upload looked up; 401 means the key was refused. */
async function keyAnswer(secret: string): Promise<number> {
  return (await request(app.server.url).get('/api/uploads/999999999').set('Authorization', `Bearer ${secret}`)).status;
}

describe('API keys across organisations and roles', () => {
  it(
    "when another organisation's administrator lists or revokes a " +
      'key, then they never see it and it keeps working',
    async () => {
      const key = await newKey();
      const theirs = (await otherAdmin.get('/api/api-keys').expect(200)).body as Array<{ id: number }>;
      expect(theirs.map((k) => k.id)).not.toContain(key.id);

      const res = await otherAdmin.delete(`/api/api-keys/${key.id}`).expect(404);
      expect(res.body.error.code).toBe('not_found');
      expect(await keyAnswer(key.secret)).toBe(404);
      const mine = (
        (await admin.get('/api/api-keys').expect(200)).body as Array<{ id: number; revokedAt: string | null }>
      ).find((k) => k.id === key.id);
      expect(mine).toMatchObject({ revokedAt: null });
    },
  );

  it('when a manager or an auditor asks for the keys, then they are refused and the key is untouched', async () => {
    const key = await newKey();
    for (const role of ['manager', 'auditor'] as const) {
      const client = await signedIn(app, world.users[role].email);
      await client.get('/api/api-keys').expect(403);
      await client.delete(`/api/api-keys/${key.id}`).expect(403);
    }
    expect(await keyAnswer(key.secret)).toBe(404);
  });

  it('when nobody is signed in, then the list is refused', async () => {
    await request(app.server.url).get('/api/api-keys').expect(401);
  });

  it(
    'when the owning administrator revokes a key twice, then it stops ' + 'working and the second try finds nothing',
    async () => {
      const key = await newKey();
      await admin.delete(`/api/api-keys/${key.id}`).expect(204);
      expect(await keyAnswer(key.secret)).toBe(401);
      await admin.delete(`/api/api-keys/${key.id}`).expect(404);
      const listed = (
        (await admin.get('/api/api-keys').expect(200)).body as Array<{
          id: number;
          revokedAt: string | null;
          secret?: string;
        }>
      ).find((k) => k.id === key.id);
      expect(listed?.revokedAt).toEqual(expect.any(String));
      expect(listed?.secret).toBeUndefined();
    },
  );
});
