import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { etoRainCsv, normals, stationForSite } from '../support/budget-fixtures';
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

/** Rate schedules per site, the budget's cost under tiers, and the organisation's unit setting. */
let app: TestApp;
let owner: World;
let utility: World;
let manager: Client;
let site: { id: number };
const GAL_PER_KGAL = 1000;

beforeAll(async () => {
  app = await createTestApp();
  owner = await createWorld(app.db);
  utility = await createWorld(app.db, 'utility');
  manager = await signedIn(app, owner.users.manager.email);
  site = await createSite(app.db, owner.org.id);
  await shareSite(app.db, site.id, utility.org.id, 'read');
});
afterAll(async () => app?.stop());

const tiered = (effectiveFrom: string) => ({
  name: 'Tiered landscape rate',
  unit: 'kgal',
  fixedChargePerPeriod: 15,
  volumeCharge: {
    kind: 'tiered',
    tiers: [
      { upToUnits: 10, pricePerUnit: 3 },
      { upToUnits: null, pricePerUnit: 5 },
    ],
  },
  effectiveFrom,
});

describe('rate schedules', () => {
  it("when a tiered schedule applies, then the month's budget cost fills the tiers bottom-up", async () => {
    const s = await createSite(app.db, owner.org.id);
    // 20,000 ft² of PF 0.5 drip turf-free planting: June with 5.08 mm (0.2 in) a day → 6.0 in.
    await manager
      .post(`/api/sites/${s.id}/hydrozones`, {
        name: 'Beds',
        area: 20000,
        areaUnit: 'ft2',
        plantFactor: 0.5,
        irrigationMethod: 'drip',
      })
      .expect(201);
    const stationId = await stationForSite(manager, s.id);
    await manager
      .put(`/api/weather-stations/${stationId}/normals`, { normals: normals({ etoMm: 120, rainMm: 10 }) })
      .expect(200);
    await manager
      .postText(
        `/api/weather-stations/${stationId}/daily?format=eto-rain`,
        etoRainCsv('2025-06-01', 30, () => [5.08, 0]),
      )
      .expect(200);
    await manager.post(`/api/sites/${s.id}/rate-schedules`, tiered('2025-01-01')).expect(201);
    const june = (await manager.get(`/api/sites/${s.id}/budget?from=2025-06&to=2025-06`).expect(200)).body.months[0];
    // 6.0 × 0.5 × 20,000 × 144/231 ÷ 0.81 = 46,176 gal = 46.18 kgal: 10 kgal at $3 + 36.18 kgal at $5 + $15.
    const kgal = (6.0 * 0.5 * 20000 * (144 / 231)) / 0.81 / GAL_PER_KGAL;
    expect(june.cost.units).toBeCloseTo(kgal, 9);
    expect(june.cost.total).toBeCloseTo(15 + 10 * 3 + (kgal - 10) * 5, 2);
    expect(june.cost.lines.map((l: { label: string }) => l.label)).toEqual(['Tier 1', 'Tier 2']);
  });

  it('when two schedules exist, then each month is priced by the one in force', async () => {
    const s = await createSite(app.db, owner.org.id);
    await manager
      .post(`/api/sites/${s.id}/hydrozones`, {
        name: 'Beds',
        area: 1000,
        areaUnit: 'ft2',
        plantFactor: 0.3,
        irrigationMethod: 'drip',
      })
      .expect(201);
    const stationId = await stationForSite(manager, s.id);
    await manager
      .put(`/api/weather-stations/${stationId}/normals`, { normals: normals({ etoMm: 120, rainMm: 10 }) })
      .expect(200);
    await manager.post(`/api/sites/${s.id}/rate-schedules`, { ...tiered('2025-01-01'), name: 'Old' }).expect(201);
    await manager.post(`/api/sites/${s.id}/rate-schedules`, { ...tiered('2025-03-01'), name: 'New' }).expect(201);
    const months = (await manager.get(`/api/sites/${s.id}/budget?from=2025-02&to=2025-03`).expect(200)).body.months;
    expect(months.map((m: { cost: { scheduleName: string } }) => m.cost.scheduleName)).toEqual(['Old', 'New']);
    expect(months[0].filledDays).toBe(28);
  });

  it.each([
    [
      'tier bounds out of order',
      {
        volumeCharge: {
          kind: 'tiered',
          tiers: [
            { upToUnits: 10, pricePerUnit: 3 },
            { upToUnits: 5, pricePerUnit: 4 },
            { upToUnits: null, pricePerUnit: 5 },
          ],
        },
      },
      'volumeCharge',
    ],
    ['a negative price', { volumeCharge: { kind: 'uniform', pricePerUnit: -1 } }, 'volumeCharge.pricePerUnit'],
    ['an unknown unit', { unit: 'liters' }, 'unit'],
    ['a bad start date', { effectiveFrom: '2025-02-30' }, 'effectiveFrom'],
  ])('when %s, then 400 names the field', async (_label, change, field) => {
    const res = await manager
      .post(`/api/sites/${site.id}/rate-schedules`, { ...tiered('2025-01-01'), ...change })
      .expect(400);
    expect(res.body.error.details.map((d: { field: string }) => d.field)).toContain(field);
  });

  it('when an auditor tries to add a schedule, then 403; reading is allowed', async () => {
    const auditor = await signedIn(app, utility.users.auditor.email);
    await auditor.post(`/api/sites/${site.id}/rate-schedules`, tiered('2024-01-01')).expect(403);
    await auditor.get(`/api/sites/${site.id}/rate-schedules`).expect(200);
  });

  it('when a schedule is edited and deleted, then the list follows', async () => {
    const created = (await manager.post(`/api/sites/${site.id}/rate-schedules`, tiered('2023-01-01')).expect(201)).body;
    const edited = (
      await manager
        .patch(`/api/sites/${site.id}/rate-schedules/${created.id}`, { fixedChargePerPeriod: 18 })
        .expect(200)
    ).body;
    expect(edited.fixedChargePerPeriod).toBe(18);
    await manager.delete(`/api/sites/${site.id}/rate-schedules/${created.id}`).expect(204);
    const list = (await manager.get(`/api/sites/${site.id}/rate-schedules`).expect(200)).body;
    expect(list.map((r: { id: number }) => r.id)).not.toContain(created.id);
  });
});

describe('organisation unit setting', () => {
  it(
    'when an administrator switches to metric, then everyone in the ' +
      'organisation reads metric; a manager may not change it',
    async () => {
      const admin = await signedIn(app, owner.users.admin.email);
      expect((await manager.get('/api/organisation/settings').expect(200)).body.unitSystem).toBe('us');
      await manager.patch('/api/organisation/settings', { unitSystem: 'metric' }).expect(403);
      expect(
        (await admin.patch('/api/organisation/settings', { unitSystem: 'metric' }).expect(200)).body.unitSystem,
      ).toBe('metric');
      expect((await manager.get('/api/organisation/settings').expect(200)).body.unitSystem).toBe('metric');
      expect(
        (await admin.patch('/api/organisation/settings', { unitSystem: 'imperial' }).expect(400)).body.error.details[0]
          .field,
      ).toBe('unitSystem');
    },
  );
});
