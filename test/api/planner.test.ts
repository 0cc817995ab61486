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
import { pdfText, weatherForSite } from '../support/report-fixtures';

let app: TestApp;
let owner: World;
let firm: World;
let stranger: World;
let siteId: number;
let turfId: number;
let manager: Client;

beforeAll(async () => {
  app = await createTestApp();
  [owner, firm, stranger] = await Promise.all([
    createWorld(app.db),
    createWorld(app.db, 'contractor'),
    createWorld(app.db),
  ]);
  siteId = (await createSite(app.db, owner.org.id, { name: 'Invented Office Park', kind: 'office-park' })).id;
  await shareSite(app.db, siteId, firm.org.id, 'read');
  manager = await signedIn(app, owner.users.manager.email);
  await weatherForSite(manager, siteId, '2025-01-01', '2025-12-31');
  const zone = (name: string, fields: object) =>
    manager.post(`/api/sites/${siteId}/hydrozones`, { name, areaUnit: 'ft2', ...fields }).expect(201);
  turfId = (await zone('Entry turf', { area: 12_000, plantFactor: 0.8, irrigationMethod: 'spray' })).body.id;
  await zone('Shrub beds', { area: 6_000, plantFactor: 0.3, irrigationMethod: 'drip' });
  await manager
    .post(`/api/sites/${siteId}/rate-schedules`, {
      name: 'Invented landscape rate',
      unit: 'kgal',
      fixedChargePerPeriod: 15,
      volumeCharge: { kind: 'uniform', pricePerUnit: 6 },
      effectiveFrom: '2024-01-01',
    })
    .expect(201);
});
afterAll(async () => app?.stop());

const planBody = () => ({
  title: 'Entry turf to low-water plants on drip',
  weatherYear: 2025,
  costOfWork: 30_000,
  currency: 'USD',
  rainSensor: false,
  zoneChanges: [{ hydrozoneId: turfId, irrigationMethod: 'drip', plantFactor: 0.2 }],
});

describe('what-if planner', () => {
  it(
    'when a manager plans spray to drip, ' + 'then ETWU, savings, money and payback follow MWELO and the site rate',
    async () => {
      const plan = (await manager.post(`/api/sites/${siteId}/plans`, planBody()).expect(201)).body;
      const c = (await manager.get(`/api/plans/${plan.id}/comparison`).expect(200)).body;
      const eto = c.weather.etoIn;
      // Non-residential office park: allowed ETAF 0.45.
      expect(c.allowedEtaf).toBe(0.45);
      expect(c.before.etwuGal).toBeCloseTo(eto * 0.62 * ((0.8 / 0.75) * 12_000 + (0.3 / 0.81) * 6_000), 3);
      expect(c.after.etwuGal).toBeCloseTo(eto * 0.62 * ((0.2 / 0.81) * 12_000 + (0.3 / 0.81) * 6_000), 3);
      expect(c.after.mawaGal).toBeCloseTo(c.before.mawaGal, 6);
      expect(Math.abs(c.savedMoney - (c.savedGal / 1000) * 6)).toBeLessThan(0.13);
      expect(c.paybackYears).toBeCloseTo(30_000 / c.savedMoney, 9);
      const text = await pdfText(manager, `/api/plans/${plan.id}/comparison.pdf`);
      expect(text).toContain('What-if plan: before and after');
      expect(text).toContain('Simple payback');
      expect(text).toContain('Entry turf');
    },
  );

  it(
    'when the plan is carried out, ' + 'then a savings project exists with its baseline chosen and the plan is closed',
    async () => {
      const plan = (await manager.post(`/api/sites/${siteId}/plans`, planBody()).expect(201)).body;
      const done = (await manager.post(`/api/plans/${plan.id}/carry-out`, { installedOn: '2026-03-10' }).expect(201))
        .body;
      expect(done.plan).toMatchObject({ status: 'carried-out', carriedOutOn: '2026-03-10', canEdit: false });
      const project = (await manager.get(`/api/savings-projects/${done.project.id}`).expect(200)).body;
      expect(project).toMatchObject({
        siteId,
        changeKind: 'spray-to-drip',
        baselineFrom: '2025-03',
        baselineTo: '2026-02',
        reportingFrom: '2026-04',
        reportingTo: '2027-03',
      });
      expect(project.changeDescription).toContain('Entry turf: spray → drip');
      await manager.post(`/api/plans/${plan.id}/carry-out`, { installedOn: '2026-03-10' }).expect(409);
      await manager.patch(`/api/plans/${plan.id}`, { costOfWork: 1 }).expect(409);
    },
  );

  it('when others ask, then auditors are refused, read-only contractors only read, and strangers get 404', async () => {
    const plan = (await manager.post(`/api/sites/${siteId}/plans`, planBody()).expect(201)).body;
    const auditor = await signedIn(app, owner.users.auditor.email);
    await auditor.get(`/api/sites/${siteId}/plans`).expect(403);
    await auditor.get(`/api/plans/${plan.id}/comparison`).expect(403);
    const reader = await signedIn(app, firm.users.contractor.email);
    const list = (await reader.get(`/api/sites/${siteId}/plans?pageSize=5`).expect(200)).body;
    expect(list.items.find((p: { id: number }) => p.id === plan.id).canEdit).toBe(false);
    await reader.patch(`/api/plans/${plan.id}`, { title: 'Ours' }).expect(403);
    await reader.post(`/api/sites/${siteId}/plans`, planBody()).expect(403);
    const outsider = await signedIn(app, stranger.users.manager.email);
    await outsider.get(`/api/plans/${plan.id}`).expect(404);
    await outsider.patch(`/api/plans/${plan.id}`, { title: 'Ours' }).expect(404);
    await outsider.post(`/api/plans/${plan.id}/carry-out`, { installedOn: '2026-03-10' }).expect(404);
    await outsider.get(`/api/plans/${plan.id}/comparison.pdf`).expect(404);
    await outsider.post(`/api/sites/${siteId}/plans`, planBody()).expect(404);
    expect((await manager.get(`/api/plans/${plan.id}`).expect(200)).body.status).toBe('draft');
  });

  it("when a change names another site's hydrozone or removes too much, then the plan is refused", async () => {
    const other = await createSite(app.db, owner.org.id);
    const foreign = (
      await manager
        .post(`/api/sites/${other.id}/hydrozones`, {
          name: 'Foreign',
          area: 100,
          areaUnit: 'ft2',
          plantFactor: 0.5,
          irrigationMethod: 'spray',
        })
        .expect(201)
    ).body.id;
    const res = await manager
      .post(`/api/sites/${siteId}/plans`, {
        ...planBody(),
        zoneChanges: [{ hydrozoneId: foreign }, { hydrozoneId: turfId, areaRemovedFt2: 99_999 }],
      })
      .expect(400);
    expect(res.body.error.details.map((d: { message: string }) => d.message)).toEqual([
      `Hydrozone ${foreign} is not on this site`,
      '"Entry turf": area removed must be 0–12000 ft²',
    ]);
  });
});
