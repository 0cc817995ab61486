import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, createTestApp, createWorld, signedIn, suffix, type TestApp, type World } from '../support/test-app';

let app: TestApp;
let world: World;
let manager: Client;

beforeAll(async () => {
  app = await createTestApp();
  world = await createWorld(app.db);
  manager = await signedIn(app, world.users.manager.email);
});
afterAll(async () => app?.stop());

const good = () => ({
  name: `Valid ${suffix()}`,
  kind: 'office-park',
  address: '12 Birch Row, Nowhere',
  timeZone: 'America/Los_Angeles',
  notes: 'ok',
  tags: ['drip'],
});
const siteCount = async () => (await manager.get('/api/sites?pageSize=1').expect(200)).body.total as number;

describe('bad site input gets a clear error naming the field, and nothing is written', () => {
  it.each([
    ['an unknown field', { owner: 'me' }, 'owner', 'is not a known field'],
    ['a wrong type', { name: 42 }, 'name', 'Invalid input: expected string, received number'],
    ['an over-long name', { name: 'x'.repeat(121) }, 'name', 'must be at most 120 characters'],
    ['an over-long address', { address: 'y'.repeat(301) }, 'address', 'must be at most 300 characters'],
    ['an empty name', { name: '   ' }, 'name', 'is required'],
    [
      'an unknown kind',
      { kind: 'golf-course' },
      'kind',
      'must be one of hoa-common-area, office-park, school-ground, streetscape, park, other',
    ],
    [
      'an invalid time zone',
      { timeZone: 'Pacific Standard Time' },
      'timeZone',
      'must be an IANA time zone such as America/Los_Angeles',
    ],
    [
      'a made-up time zone',
      { timeZone: 'Mars/Olympus_Mons' },
      'timeZone',
      'must be an IANA time zone such as America/Los_Angeles',
    ],
    ['a tag with spaces', { tags: ['two words'] }, 'tags.0', 'may hold lower-case letters, digits and dashes'],
    ['too many tags', { tags: Array.from({ length: 21 }, (_, i) => `t${i}`) }, 'tags', 'at most 20 tags'],
  ])('when creating with %s, then 400 on that field', async (_label, change, field, message) => {
    const before = await siteCount();
    const res = await manager.post('/api/sites', { ...good(), ...change }).expect(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details).toContainEqual({ field, message });
    expect(await siteCount()).toBe(before);
  });

  it('when a second site gets the same name in one organisation, then 409 on name and only one exists', async () => {
    const body = good();
    await manager.post('/api/sites', body).expect(201);
    const res = await manager.post('/api/sites', { ...body, address: 'elsewhere' }).expect(409);
    expect(res.body.error.details).toEqual([{ field: 'name', message: 'is already used by another site' }]);
    expect((await manager.get(`/api/sites?q=${encodeURIComponent(body.name)}`)).body.total).toBe(1);
  });

  it('when a rename collides with another site, then 409 and the site keeps its name', async () => {
    const a = (await manager.post('/api/sites', good()).expect(201)).body;
    const b = (await manager.post('/api/sites', good()).expect(201)).body;
    await manager.patch(`/api/sites/${b.id}`, { name: a.name }).expect(409);
    expect((await manager.get(`/api/sites/${b.id}`)).body.name).toBe(b.name);
  });

  it('when another organisation uses the same name, then that is allowed', async () => {
    const other = await createWorld(app.db);
    const body = good();
    await manager.post('/api/sites', body).expect(201);
    await (await signedIn(app, other.users.admin.email)).post('/api/sites', body).expect(201);
  });

  it('when an edit has one bad field among good ones, then no field changes', async () => {
    const site = (await manager.post('/api/sites', good()).expect(201)).body;
    await manager.patch(`/api/sites/${site.id}`, { notes: 'changed', timeZone: 'Nowhere/Atlantis' }).expect(400);
    expect((await manager.get(`/api/sites/${site.id}`)).body.notes).toBe('ok');
  });

  it('when the body is not JSON, then 400 with a plain message', async () => {
    const res = await manager.agent
      .post('/api/sites')
      .set('x-xsrf-token', (manager as unknown as { csrf: string }).csrf)
      .set('content-type', 'application/json')
      .send('{"name": ');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe('The request body is not valid JSON.');
  });

  it('when list parameters are out of range, then 400 naming them', async () => {
    const res = await manager.get('/api/sites?pageSize=5000&sort=password&dir=sideways').expect(400);
    expect(res.body.error.details.map((d: { field: string }) => d.field).sort()).toEqual(['dir', 'pageSize', 'sort']);
  });
});

describe('site lists are paged, sorted and filtered on the server', () => {
  it('when sorted by name descending with page size 2, then pages follow one another without overlap', async () => {
    const world2 = await createWorld(app.db);
    const admin = await signedIn(app, world2.users.admin.email);
    for (const name of ['Aspen Court', 'Birch Yard', 'Cedar Walk', 'Dogwood Green', 'Elm Plaza']) {
      await admin
        .post('/api/sites', {
          ...good(),
          name,
          tags: name.startsWith('C') || name.startsWith('E') ? ['reclaimed'] : [],
        })
        .expect(201);
    }
    const p0 = (await admin.get('/api/sites?sort=name&dir=desc&pageSize=2&page=0').expect(200)).body;
    const p1 = (await admin.get('/api/sites?sort=name&dir=desc&pageSize=2&page=1').expect(200)).body;
    expect(p0.total).toBe(5);
    expect([...p0.items, ...p1.items].map((s: { name: string }) => s.name)).toEqual([
      'Elm Plaza',
      'Dogwood Green',
      'Cedar Walk',
      'Birch Yard',
    ]);
    const tagged = (await admin.get('/api/sites?tag=reclaimed').expect(200)).body;
    expect(tagged.items.map((s: { name: string }) => s.name)).toEqual(['Cedar Walk', 'Elm Plaza']);
    const searched = (await admin.get('/api/sites?q=og').expect(200)).body;
    expect(searched.items.map((s: { name: string }) => s.name)).toEqual(['Dogwood Green']);
    // A LIKE wildcard typed by the user is taken literally.
    expect((await admin.get('/api/sites?q=%25').expect(200)).body.total).toBe(0);
  });
});

describe('audit log', () => {
  it('when a site is created and edited, then the admin sees who changed which field', async () => {
    const admin = await signedIn(app, world.users.admin.email);
    const site = (await manager.post('/api/sites', good()).expect(201)).body;
    await manager.patch(`/api/sites/${site.id}`, { notes: 'new note' }).expect(200);
    const log = (await admin.get(`/api/audit?entity=site&entityId=${site.id}`).expect(200)).body;
    expect(log.items.map((e: { action: string }) => e.action)).toEqual(['update', 'create']);
    expect(log.items[0]).toMatchObject({ userId: world.users.manager.id, changes: { notes: ['ok', 'new note'] } });
    await manager.get('/api/audit').expect(403);
  });
});
