import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@shared/auth/roles';
import {
  createSite,
  createTestApp,
  createWorld,
  shareSite,
  signedIn,
  suffix,
  type Client,
  type TestApp,
  type World,
} from '../support/test-app';

/** Hydrozones are technical data: `contribute` may change them, `read` may only look, strangers see nothing. */
let app: TestApp;
let owner: World;
let firm: World;
let utility: World;
let stranger: World;
let site: { id: number };
const clients = new Map<string, Client>();
type Who = `${'owner' | 'firm' | 'utility' | 'stranger'}.${Role}`;
const client = (who: Who) => clients.get(who)!;
const zone = (over: object = {}) => ({
  name: `Zone ${suffix()}`,
  area: 800,
  areaUnit: 'ft2',
  plantWaterUse: 'low',
  irrigationMethod: 'drip',
  ...over,
});

beforeAll(async () => {
  app = await createTestApp();
  owner = await createWorld(app.db);
  firm = await createWorld(app.db, 'contractor');
  utility = await createWorld(app.db, 'utility');
  stranger = await createWorld(app.db);
  site = await createSite(app.db, owner.org.id);
  await shareSite(app.db, site.id, firm.org.id, 'contribute');
  await shareSite(app.db, site.id, utility.org.id, 'read');
  for (const [label, w] of Object.entries({ owner, firm, utility, stranger })) {
    for (const role of ['admin', 'manager', 'contractor', 'auditor'] as Role[])
      clients.set(`${label}.${role}`, await signedIn(app, w.users[role].email));
  }
});
afterAll(async () => app?.stop());

describe('hydrozone access by role', () => {
  // [who, list, create/edit/delete]
  it.each([
    ['owner.admin', 200, 201],
    ['owner.manager', 200, 201],
    ['owner.contractor', 200, 201],
    ['owner.auditor', 200, 403],
    ['firm.contractor', 200, 201],
    ['firm.admin', 200, 201],
    ['firm.auditor', 200, 403],
    ['utility.auditor', 200, 403],
    ['utility.admin', 200, 403],
    ['stranger.admin', 404, 404],
    ['stranger.manager', 404, 404],
  ] as [Who, number, number][])('%s: list %i, create %i', async (who, list, create) => {
    const c = client(who);
    expect((await c.get(`/api/sites/${site.id}/hydrozones`)).status).toBe(list);
    const created = await c.post(`/api/sites/${site.id}/hydrozones`, zone());
    expect(created.status).toBe(create);
    // Edits and deletes are tried on a zone the owner made, so every row starts from the same state.
    const target = (await client('owner.manager').post(`/api/sites/${site.id}/hydrozones`, zone()).expect(201)).body;
    const edited = await c.patch(`/api/sites/${site.id}/hydrozones/${target.id}`, { notes: `by ${who}` });
    expect(edited.status).toBe(create === 201 ? 200 : create);
    if (edited.status === 200) expect(edited.body.notes).toBe(`by ${who}`);
    expect((await c.delete(`/api/sites/${site.id}/hydrozones/${target.id}`)).status).toBe(
      create === 201 ? 204 : create,
    );
  });

  it('when a hydrozone is looked up through another site, then 404', async () => {
    const other = await createSite(app.db, owner.org.id);
    const z = (await client('owner.manager').post(`/api/sites/${site.id}/hydrozones`, zone()).expect(201)).body;
    await client('owner.manager').get(`/api/sites/${other.id}/hydrozones/${z.id}`).expect(404);
    await client('owner.manager').patch(`/api/sites/${other.id}/hydrozones/${z.id}`, { notes: 'x' }).expect(404);
  });
});

describe('hydrozone input', () => {
  const post = (body: object) => client('owner.manager').post(`/api/sites/${site.id}/hydrozones`, zone(body));
  const fieldOf = (res: { body: { error: { details: { field: string }[] } } }) =>
    res.body.error.details.map((d) => d.field);

  it.each([
    ['zero area', { area: 0 }, 'area'],
    ['negative area', { area: -50 }, 'area'],
    ['plant factor above 1', { plantWaterUse: null, plantFactor: 1.5 }, 'plantFactor'],
    ['plant factor outside its category', { plantWaterUse: 'low', plantFactor: 0.5 }, 'plantFactor'],
    ['neither plant factor nor category', { plantWaterUse: null }, 'plantFactor'],
    ['efficiency of zero', { efficiencyOverride: 0 }, 'efficiencyOverride'],
    ['efficiency above one', { efficiencyOverride: 1.2 }, 'efficiencyOverride'],
    ['special area without its kind', { specialLandscapeArea: true }, 'specialLandscapeKind'],
    ['emitter count without gph', { emitterCount: 40 }, 'emitterGph'],
    ['unknown method', { irrigationMethod: 'flood' }, 'irrigationMethod'],
    ['unknown field', { colour: 'green' }, 'colour'],
  ])('when %s, then 400 names the field and nothing is stored', async (_label, body, field) => {
    const before = (await client('owner.manager').get(`/api/sites/${site.id}/hydrozones`).expect(200)).body.total;
    const res = await post(body).expect(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(fieldOf(res)).toContain(field);
    expect((await client('owner.manager').get(`/api/sites/${site.id}/hydrozones`).expect(200)).body.total).toBe(before);
  });

  it('when an edit would make the zone invalid, then 400 and the zone keeps its values', async () => {
    const z = (await post({}).expect(201)).body;
    const res = await client('owner.manager')
      .patch(`/api/sites/${site.id}/hydrozones/${z.id}`, { efficiencyOverride: 0 })
      .expect(400);
    expect(fieldOf(res)).toContain('efficiencyOverride');
    const after = (await client('owner.manager').get(`/api/sites/${site.id}/hydrozones/${z.id}`).expect(200)).body;
    expect(after.efficiencyOverride).toBeNull();
  });

  it('when the area is given in m², then it is stored in ft² (1 m² = 1/0.09290304 ft², NIST)', async () => {
    const z = (await post({ area: 250, areaUnit: 'm2' }).expect(201)).body;
    expect(z.areaFt2).toBeCloseTo(250 / 0.09290304, 9);
  });

  it(
    'when only the category is given, then the MWELO range midpoint ' + 'and the method default efficiency are used',
    async () => {
      const z = (await post({ plantWaterUse: 'moderate', irrigationMethod: 'spray' }).expect(201)).body;
      expect(z.effectivePlantFactor).toBe(0.5);
      expect(z.effectiveEfficiency).toBe(0.75);
      expect(z.efficiencySource).toMatch(/App\. B/);
    },
  );

  it('when two zones of a site share a name, then 409', async () => {
    const name = `Twin ${suffix()}`;
    await post({ name }).expect(201);
    const res = await post({ name }).expect(409);
    expect(fieldOf(res)).toContain('name');
  });
});
