import { afterAll, beforeAll, describe, expect, it } from 'vitest';
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
import { insertMonthlyUse, monthEto, monthsBetween, weatherForSite } from '../support/report-fixtures';

let app: TestApp;
let owner: World;
let utility: World;
let stranger: World;
let manager: Client;
const YEAR = monthsBetween('2025-01', '2025-12');
const yearEtoIn = YEAR.reduce((s, m) => s + monthEto(m), 0) / 25.4;
const sites: { id: number; etaf: number }[] = [];

/** A site watered at `etaf` over 10,000 ft², every month metered (`meteredDays` short when incomplete). */
async function siteAt(etaf: number, kind: 'park' | 'hoa-common-area', meteredDays?: number): Promise<number> {
  const site = await createSite(app.db, owner.org.id, { kind });
  await weatherForSite(manager, site.id, '2025-01-01', '2025-12-31');
  await manager
    .post(`/api/sites/${site.id}/hydrozones`, {
      name: 'Lawn',
      area: 10_000,
      areaUnit: 'ft2',
      plantFactor: 0.6,
      irrigationMethod: 'spray',
    })
    .expect(201);
  for (const m of YEAR)
    await insertMonthlyUse(app.db, site.id, m, etaf * (monthEto(m) / 25.4) * 10_000 * 0.62, meteredDays);
  return site.id;
}

beforeAll(async () => {
  app = await createTestApp();
  [owner, utility, stranger] = await Promise.all([
    createWorld(app.db),
    createWorld(app.db, 'utility'),
    createWorld(app.db),
  ]);
  manager = await signedIn(app, owner.users.manager.email);
  for (const etaf of [0.62, 0.38, 0.5]) sites.push({ id: await siteAt(etaf, 'park'), etaf });
  sites.push({ id: await siteAt(0.2, 'park', 20), etaf: 0.2 });
  await shareSite(app.db, sites[0]!.id, utility.org.id, 'read');
});
afterAll(async () => app?.stop());

describe('achieved ETAF', () => {
  it('when a year is metered, then achieved ETAF = use ÷ (ETo × area × 0.62), ranked lowest first', async () => {
    const report = (await manager.get('/api/etaf?from=2025-01&to=2025-12&sort=rank&pageSize=10').expect(200)).body;
    const mine = report.items.filter((r: { siteId: number }) => sites.some((s) => s.id === r.siteId));
    expect(mine.map((r: { siteId: number }) => r.siteId)).toEqual([
      sites[1]!.id,
      sites[2]!.id,
      sites[0]!.id,
      sites[3]!.id,
    ]);
    for (const row of mine.slice(0, 3)) {
      const truth = sites.find((s) => s.id === row.siteId)!.etaf;
      expect(row.etoIn).toBeCloseTo(yearEtoIn, 6);
      expect(row.achievedEtaf).toBeCloseTo(truth, 6);
      expect(row.galPerFt2).toBeCloseTo(row.useGal / 10_000, 9);
      expect(row.allowedEtaf).toBe(0.45);
      expect(row.peerCount).toBe(3);
    }
    expect(mine[0].peerPercentile).toBeCloseTo(100 / 3, 9);
    // A site metered 20 days a month is shown but not ranked.
    expect(mine[3]).toMatchObject({ rank: null, complete: false });
    expect(report.summary).toMatchObject({ ranked: 3 });
    expect(report.histogram.reduce((s: number, b: { count: number }) => s + b.count, 0)).toBe(3);
  });

  it("when the allowed ETAF is set, then only managers write it and the site's standing uses it", async () => {
    const id = sites[0]!.id;
    const contractor = await signedIn(app, owner.users.contractor.email);
    await contractor.put(`/api/sites/${id}/etaf-setting`, { allowedEtaf: 0.55, basis: 'residential' }).expect(403);
    const saved = (await manager.put(`/api/sites/${id}/etaf-setting`, { allowedEtaf: 0.7, basis: 'local' }).expect(200))
      .body;
    expect(saved).toMatchObject({ allowedEtaf: 0.7, basis: 'local', isDefault: false });
    const standing = (await contractor.get(`/api/sites/${id}/etaf?from=2025-01&to=2025-12`).expect(200)).body;
    expect(standing.row.allowedEtaf).toBe(0.7);
    expect(standing.row.percentOfAllowance).toBeCloseTo((100 * 0.62) / 0.7, 4);
    expect(standing.peers.count).toBe(3);
  });

  it(
    'when another organisation asks, ' + 'then it sees only what is shared with it and cannot read or write the rest',
    async () => {
      const auditor = await signedIn(app, utility.users.auditor.email);
      const theirs = (await auditor.get('/api/etaf?from=2025-01&to=2025-12').expect(200)).body;
      expect(theirs.items.map((r: { siteId: number }) => r.siteId)).toEqual([sites[0]!.id]);
      await auditor.put(`/api/sites/${sites[0]!.id}/etaf-setting`, { allowedEtaf: 0.3, basis: 'local' }).expect(403);
      const outsider = await signedIn(app, stranger.users.manager.email);
      const none = (await outsider.get('/api/etaf?from=2025-01&to=2025-12').expect(200)).body;
      expect(none.items.some((r: { siteId: number }) => sites.some((s) => s.id === r.siteId))).toBe(false);
      await outsider.get(`/api/sites/${sites[1]!.id}/etaf`).expect(404);
      await outsider.get(`/api/sites/${sites[1]!.id}/etaf-setting`).expect(404);
      await outsider.put(`/api/sites/${sites[1]!.id}/etaf-setting`, { allowedEtaf: 1, basis: 'local' }).expect(404);
      expect((await manager.get(`/api/sites/${sites[1]!.id}/etaf-setting`).expect(200)).body.isDefault).toBe(true);
    },
  );

  it('when the period is too long or backwards, then it says so', async () => {
    await manager.get('/api/etaf?from=2023-01&to=2025-12').expect(400);
    await manager.get('/api/etaf?from=2025-06&to=2025-01').expect(400);
  });
});
