import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@shared/auth/roles';
import {
  Client,
  createSite,
  createTestApp,
  createWorld,
  shareSite,
  signedIn,
  suffix,
  type TestApp,
  type World,
} from '../support/test-app';

/**
 * Who may do what on sites, as a table. The owner organisation shares site A with a contractor firm
 * (contribute) and a utility (read); site B is not shared; another management company sees neither.
 */
let app: TestApp;
let owner: World;
let firm: World;
let utility: World;
let stranger: World;
let siteA: { id: number; name: string };
let siteB: { id: number; name: string };
const clients = new Map<string, Client>();

type Who = `${'owner' | 'firm' | 'utility' | 'stranger'}.${Role}`;
const client = (who: Who) => clients.get(who)!;

beforeAll(async () => {
  app = await createTestApp();
  owner = await createWorld(app.db);
  firm = await createWorld(app.db, 'contractor');
  utility = await createWorld(app.db, 'utility');
  stranger = await createWorld(app.db);
  siteA = await createSite(app.db, owner.org.id);
  siteB = await createSite(app.db, owner.org.id);
  await shareSite(app.db, siteA.id, firm.org.id, 'contribute');
  await shareSite(app.db, siteA.id, utility.org.id, 'read');
  for (const [label, world] of Object.entries({ owner, firm, utility, stranger })) {
    for (const role of ['admin', 'manager', 'contractor', 'auditor'] as Role[]) {
      clients.set(`${label}.${role}`, await signedIn(app, world.users[role].email));
    }
  }
});
afterAll(async () => app?.stop());

// [who, read A, edit A, delete A, share A, read B]; 404 where the site must look as if it did not exist.
const matrix: [Who, number, number, number, number, number][] = [
  ['owner.admin', 200, 200, 204, 200, 200],
  ['owner.manager', 200, 200, 403, 403, 200],
  ['owner.contractor', 200, 403, 403, 403, 200],
  ['owner.auditor', 200, 403, 403, 403, 200],
  ['firm.admin', 200, 403, 403, 403, 404],
  ['firm.contractor', 200, 403, 403, 403, 404],
  ['firm.auditor', 200, 403, 403, 403, 404],
  ['utility.auditor', 200, 403, 403, 403, 404],
  ['utility.admin', 200, 403, 403, 403, 404],
  ['stranger.admin', 404, 404, 404, 404, 404],
  ['stranger.manager', 404, 404, 404, 404, 404],
];

describe('site access matrix', () => {
  it.each(matrix)(
    '%s: read A %i, edit A %i, delete A %i, share A %i, read B %i',
    async (who, read, edit, del, share, readB) => {
      const c = client(who);
      expect((await c.get(`/api/sites/${siteA.id}`)).status).toBe(read);
      const note = `edited by ${who} ${suffix()}`;
      const patched = await c.patch(`/api/sites/${siteA.id}`, { notes: note });
      expect(patched.status).toBe(edit);
      if (edit === 200) expect(patched.body.notes).toBe(note);
      const shared = await c.put(`/api/sites/${siteA.id}/shares/${stranger.org.id}`, { access: 'read' });
      expect(shared.status).toBe(share);
      if (shared.status === 200) await c.delete(`/api/sites/${siteA.id}/shares/${stranger.org.id}`).expect(204);
      // Delete is tried on a site of its own, so the other rows keep site A.
      const victim = await createSite(app.db, owner.org.id);
      await shareSite(app.db, victim.id, firm.org.id, 'contribute');
      await shareSite(app.db, victim.id, utility.org.id, 'read');
      expect((await c.delete(`/api/sites/${victim.id}`)).status).toBe(del);
      expect((await c.get(`/api/sites/${siteB.id}`)).status).toBe(readB);
    },
  );
});

describe('creating sites and managing users, by role', () => {
  const body = () => ({
    name: `New ${suffix()}`,
    kind: 'park',
    address: '5 Fern Row, Nowhere',
    timeZone: 'America/Denver',
    tags: ['demo'],
  });
  it.each([
    ['owner.admin', 201, 200],
    ['owner.manager', 201, 403],
    ['owner.contractor', 403, 403],
    ['owner.auditor', 403, 403],
    ['firm.contractor', 403, 403],
    ['utility.auditor', 403, 403],
  ] as [Who, number, number][])('%s: create site %i, list users %i', async (who, create, users) => {
    expect((await client(who).post('/api/sites', body())).status).toBe(create);
    expect((await client(who).get('/api/users')).status).toBe(users);
    const invite = await client(who).post('/api/users/invitations', {
      email: `x-${suffix()}@test.example`,
      displayName: 'X',
      role: 'manager',
    });
    expect(invite.status).toBe(users === 200 ? 201 : 403);
  });

  it('when not signed in, then every data route answers 401', async () => {
    const anon = new Client(app.server.url);
    await anon.fetchCsrf();
    for (const res of [
      await anon.get('/api/sites'),
      await anon.get(`/api/sites/${siteA.id}`),
      await anon.get('/api/sites/tags'),
      await anon.post('/api/sites', body()),
      await anon.patch(`/api/sites/${siteA.id}`, { notes: 'x' }),
      await anon.delete(`/api/sites/${siteA.id}`),
      await anon.get('/api/users'),
      await anon.get('/api/audit'),
      await anon.get('/api/auth/me'),
    ]) {
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe('unauthenticated');
    }
  });
});

describe('isolation between organisations', () => {
  it('when another organisation lists sites, tags or searches by name, then none of ours appear', async () => {
    const tag = `secret-${suffix()}`;
    const mine = await client('owner.manager')
      .post('/api/sites', {
        name: `Hidden ${suffix()}`,
        kind: 'park',
        address: '1 Quiet Lane',
        timeZone: 'UTC',
        tags: [tag],
      })
      .expect(201);
    const c = client('stranger.admin');
    const list = await c.get('/api/sites?pageSize=200').expect(200);
    expect(list.body.items.every((s: { organisationId: number }) => s.organisationId === stranger.org.id)).toBe(true);
    expect((await c.get(`/api/sites?q=${encodeURIComponent(mine.body.name)}`)).body.total).toBe(0);
    expect((await c.get(`/api/sites?tag=${tag}`)).body.total).toBe(0);
    expect((await c.get('/api/sites/tags')).body).not.toContain(tag);
  });

  it('when another organisation guesses site IDs, then each looks exactly like a missing site', async () => {
    const c = client('stranger.admin');
    const missing = await c.get('/api/sites/999999999').expect(404);
    const guessed = await c.get(`/api/sites/${siteB.id}`).expect(404);
    expect(guessed.body).toEqual(missing.body);
    // Walk the IDs around ours: only the stranger's own sites may answer 200.
    for (let id = Math.max(1, siteA.id - 5); id <= siteB.id + 5; id++) {
      const res = await c.get(`/api/sites/${id}`);
      if (res.status === 200) expect(res.body.organisationId).toBe(stranger.org.id);
      else expect(res.status).toBe(404);
    }
  });

  it('when another organisation tries to change or delete our site, then 404 and nothing changes', async () => {
    const c = client('stranger.admin');
    const before = (await client('owner.admin').get(`/api/sites/${siteB.id}`).expect(200)).body;
    await c.patch(`/api/sites/${siteB.id}`, { name: 'Taken over' }).expect(404);
    await c.delete(`/api/sites/${siteB.id}`).expect(404);
    await c.put(`/api/sites/${siteB.id}/shares/${stranger.org.id}`, { access: 'contribute' }).expect(404);
    const after = (await client('owner.admin').get(`/api/sites/${siteB.id}`).expect(200)).body;
    expect(after).toEqual(before);
  });

  it('when an admin of another organisation targets our users, then 404 and no e-mail is sent', async () => {
    const c = client('stranger.admin');
    await c.patch(`/api/users/${owner.users.manager.id}`, { role: 'auditor' }).expect(404);
    await c.post(`/api/users/${owner.users.manager.id}/password-reset`).expect(404);
    const users = await c.get('/api/users?pageSize=200').expect(200);
    expect(users.body.items.map((u: { email: string }) => u.email)).not.toContain(owner.users.manager.email);
    const me = await client('owner.manager').get('/api/auth/me').expect(200);
    expect(me.body.organisation.role).toBe('manager');
  });

  it("when a shared organisation reads our site, then it does not see the site's other shares", async () => {
    const seenByFirm = await client('firm.contractor').get(`/api/sites/${siteA.id}`).expect(200);
    expect(seenByFirm.body.shares).toEqual([]);
    expect(seenByFirm.body.access).toBe('contribute');
    // Instead it learns who shared the site with it, what the share grants and since when.
    expect(seenByFirm.body.organisationName).toBe(owner.org.name);
    expect(seenByFirm.body.sharedWithYou).toMatchObject({ access: 'contribute' });
    expect(Date.parse(seenByFirm.body.sharedWithYou.since)).not.toBeNaN();
    const seenByOwner = await client('owner.admin').get(`/api/sites/${siteA.id}`).expect(200);
    expect(seenByOwner.body.sharedWithYou).toBeNull();
    expect(seenByOwner.body.shares.map((s: { organisationId: number }) => s.organisationId).sort()).toEqual(
      [firm.org.id, utility.org.id].sort(),
    );
  });
});
