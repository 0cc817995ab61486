import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DailyUseRepository } from '../../backend/src/components/readings/data/daily-use-repository';
import { normals, etoRainCsv, stationForSite } from '../support/budget-fixtures';
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

/**
 * One budgeted site worked by hand. June 2025 in Los Angeles: 5.08 mm (0.2 in) ETo a day, no rain, so
 * 6.0 in for the month; shrubs 1,000 ft², PF 0.5, drip IE 0.81 → 6.0 × 0.5 × 1,000 × 144/231 ÷ 0.81 gal
 * (MWELO App. B). Readings: 4 gal every hour of every local day of June = 30 × 24 × 4 = 2,880 gal.
 * Rate: uniform 4 per CCF (748.052 gal) → the 571.2 gal over budget cost 571.2 ÷ 748.052 × 4.
 */
const BUDGET = (6.0 * 0.5 * 1000 * (144 / 231)) / 0.81;
const USE = 30 * 24 * 4;
const GAL_PER_CCF = 100 * (1728 / 231);

let app: TestApp;
let owner: World;
let contractorOrg: World;
let utility: World;
let stranger: World;
let manager: Client;
let budgeted: { id: number; name: string };
let unbudgeted: { id: number; name: string };
let privateSite: { id: number; name: string };

async function hourlyReadings(siteId: number, fromUtc: string, hours: number, gallons: (hour: number) => number) {
  const meter = await app.db.query(
    `INSERT INTO meter (site_id, ref, unit, register_multiplier, purpose, water_source) VALUES (?,
      ?, 'gal', 1, 'dedicated-irrigation', 'recycled')`,
    [siteId, `M-${suffix()}`],
  );
  const [upload] = await app.db.query(
    `INSERT INTO upload (site_id, file_name, status) VALUES (?, 'readings.csv', 'done') RETURNING id`,
    [siteId],
  );
  const start = Date.parse(fromUtc);
  const rows = Array.from({ length: hours }, (_, h) => [
    meter.insertId,
    new Date(start + h * 3_600_000),
    60,
    gallons(h),
    gallons(h),
    'gal',
    upload.id,
  ]);
  await app.db.query(
    `INSERT INTO meter_reading (meter_id, start_utc, minutes, volume_gal, original_value,
      original_unit, upload_id) VALUES ?`,
    [rows],
  );
  await app.db.transaction((em) => new DailyUseRepository(app.db).rebuildSite(em, siteId));
}

beforeAll(async () => {
  app = await createTestApp();
  owner = await createWorld(app.db);
  contractorOrg = await createWorld(app.db, 'contractor');
  utility = await createWorld(app.db, 'utility');
  stranger = await createWorld(app.db);
  manager = await signedIn(app, owner.users.manager.email);
  const tag = `dash-${suffix()}`;
  // A name that a spreadsheet would run as a formula, to check the CSV export neutralises it.
  budgeted = await createSite(app.db, owner.org.id, { name: `=Sum Park ${suffix()}` });
  unbudgeted = await createSite(app.db, owner.org.id, { name: `Bare Yard ${suffix()}` });
  privateSite = await createSite(app.db, owner.org.id, { name: `Quiet Court ${suffix()}` });
  await app.db.query('INSERT INTO site_tag (site_id, tag) VALUES (?, ?), (?, ?)', [
    budgeted.id,
    tag,
    unbudgeted.id,
    tag,
  ]);
  await shareSite(app.db, budgeted.id, contractorOrg.org.id, 'contribute');
  await shareSite(app.db, budgeted.id, utility.org.id, 'read');

  await manager
    .post(`/api/sites/${budgeted.id}/hydrozones`, {
      name: 'Shrub bed',
      area: 1000,
      areaUnit: 'ft2',
      plantFactor: 0.5,
      irrigationMethod: 'drip',
    })
    .expect(201);
  const stationId = await stationForSite(manager, budgeted.id);
  await manager
    .put(`/api/weather-stations/${stationId}/normals`, { normals: normals({ etoMm: 150, rainMm: 20 }) })
    .expect(200);
  await manager
    .postText(
      `/api/weather-stations/${stationId}/daily?format=eto-rain`,
      etoRainCsv('2025-06-01', 30, () => [5.08, 0]),
    )
    .expect(200);
  await manager
    .post(`/api/sites/${budgeted.id}/rate-schedules`, {
      name: 'Uniform',
      unit: 'ccf',
      fixedChargePerPeriod: 20,
      volumeCharge: { kind: 'uniform', pricePerUnit: 4 },
      effectiveFrom: '2025-01-01',
    })
    .expect(201);
  // 1 June 00:00 PDT = 07:00 UTC; 720 hours later is 1 July 00:00 PDT.
  await hourlyReadings(budgeted.id, '2025-06-01T07:00:00Z', 720, () => 4);
  // The unbudgeted site: 10 gal at 02:00 local on each of the first 10 days (a night leak), nothing else.
  await hourlyReadings(unbudgeted.id, '2025-06-01T09:00:00Z', 217, (h) => (h % 24 === 0 ? 10 : 0));
  await hourlyReadings(privateSite.id, '2025-06-01T07:00:00Z', 24, () => 1);
  (globalThis as Record<string, unknown>)['dashTag'] = tag;
});
afterAll(async () => app?.stop());

const june = '/api/portfolio?period=month&from=2025-06-01';

describe('portfolio', () => {
  it("when the manager opens June, then the budgeted site's use, budget and percent match the hand sums", async () => {
    const body = (
      await manager.get(`${june}&sort=name&dir=asc&pageSize=200&organisationId=${owner.org.id}`).expect(200)
    ).body;
    expect(body.period).toMatchObject({ from: '2025-06-01', to: '2025-06-30' });
    expect(body.sites.total).toBe(3);
    const row = body.sites.items.find((r: { siteId: number }) => r.siteId === budgeted.id);
    expect(row.useGallons).toBeCloseTo(USE, 6);
    expect(row.budgetGallons).toBeCloseTo(BUDGET, 4);
    expect(row.percentOfBudget).toBeCloseTo((USE / BUDGET) * 100, 4);
    expect(row.trend).toHaveLength(12);
    expect(row.trend.at(-1)).toEqual({ month: '2025-06', gallons: USE });
    expect(row.lastDataAt).toBe('2025-07-01T07:00:00.000Z');
    const bare = body.sites.items.find((r: { siteId: number }) => r.siteId === unbudgeted.id);
    expect(bare.useGallons).toBe(100);
    expect(bare.budgetGallons).toBeNull();
    expect(bare.budgetProblem).toMatch(/hydrozone/);
    // Headline: over budget is only the budgeted site's excess; money at 4 per CCF.
    expect(body.headline.siteCount).toBe(3);
    expect(body.headline.period.useGallons).toBeCloseTo(USE + 100 + 24, 6);
    expect(body.headline.period.budgetGallons).toBeCloseTo(BUDGET, 4);
    expect(body.headline.overBudgetGallons).toBeCloseTo(USE - BUDGET, 4);
    expect(body.headline.overBudgetCost).toBeCloseTo(Math.round(((USE - BUDGET) / GAL_PER_CCF) * 4 * 100) / 100, 2);
    expect(body.headline.currency).toBe('USD');
    expect(body.headline.sitesOverBudget).toBe(1);
    // Year to date runs from 1 Oct 2024: same use (no earlier readings).
    expect(body.yearToDate).toEqual({ from: '2024-10-01', to: '2025-06-30' });
    expect(body.headline.yearToDate.useGallons).toBeCloseTo(USE + 124, 6);
  });

  it(
    'when sorted by percent descending and filtered by condition ' + 'or tag, then the server sorts, filters and pages',
    async () => {
      const tag = (globalThis as Record<string, unknown>)['dashTag'] as string;
      const over = (await manager.get(`${june}&condition=over-budget&organisationId=${owner.org.id}`).expect(200)).body;
      expect(over.sites.items.map((r: { siteId: number }) => r.siteId)).toEqual([budgeted.id]);
      const tagged = (await manager.get(`${june}&tag=${tag}&sort=useGallons&dir=desc`).expect(200)).body;
      expect(tagged.sites.items.map((r: { siteId: number }) => r.siteId)).toEqual([budgeted.id, unbudgeted.id]);
      expect(tagged.sites.items.map((r: { tags: string[] }) => r.tags)).toEqual([[tag], [tag]]);
      const paged = (await manager.get(`${june}&tag=${tag}&sort=useGallons&dir=desc&page=1&pageSize=1`).expect(200))
        .body;
      expect(paged.sites).toMatchObject({ total: 2, page: 1, pageSize: 1 });
      expect(paged.sites.items[0].siteId).toBe(unbudgeted.id);
      await manager.get(`${june}&sort=bogus`).expect(400);
    },
  );

  it(
    'when a contractor, an auditor or another organisation asks, ' + 'then each sees only what is shared with it',
    async () => {
      for (const [world, expected] of [
        [contractorOrg, [budgeted.id]],
        [utility, [budgeted.id]],
        [stranger, []],
      ] as const) {
        for (const role of ['manager', 'contractor', 'auditor'] as const) {
          const client = await signedIn(app, world.users[role].email);
          const body = (await client.get(june).expect(200)).body;
          expect(body.sites.items.map((r: { siteId: number }) => r.siteId)).toEqual(expected);
          const status = expected.length ? 200 : 404;
          await client.get(`/api/sites/${budgeted.id}/overview?from=2025-06-01&to=2025-06-30`).expect(status);
          await client.get(`/api/sites/${privateSite.id}/monthly?from=2025-06&to=2025-06`).expect(404);
          await client.get(`/api/sites/${privateSite.id}/hourly-grid?month=2025-06`).expect(404);
        }
      }
      const auditor = await signedIn(app, owner.users.auditor.email);
      expect((await auditor.get(`${june}&organisationId=${owner.org.id}`).expect(200)).body.sites.total).toBe(3);
    },
  );
});

describe('site dashboard', () => {
  it('when the overview covers June, then daily use and the ETo-spread budget add up to the month', async () => {
    const body = (await manager.get(`/api/sites/${budgeted.id}/overview?from=2025-06-01&to=2025-06-30`).expect(200))
      .body;
    expect(body.days).toHaveLength(30);
    expect(body.days[0]).toMatchObject({ date: '2025-06-01', useGallons: 96, etoMm: 5.08, rainMm: 0 });
    expect(body.days[0].budgetGallons).toBeCloseTo(BUDGET / 30, 6);
    expect(body.figures.useGallons).toBeCloseTo(USE, 6);
    expect(body.figures.budgetGallons).toBeCloseTo(BUDGET, 4);
    expect(body.figures.daysWithData).toBe(30);
  });

  it('when the hour-by-day grid is read, then the night leak sits at 02:00 local time', async () => {
    const body = (await manager.get(`/api/sites/${unbudgeted.id}/hourly-grid?month=2025-06`).expect(200)).body;
    expect(body.days).toHaveLength(30);
    expect(body.days[0].hours[2]).toBe(10);
    expect(body.days[0].hours[3]).toBe(0);
    expect(body.days[10].hours[2]).toBeNull();
    expect(body.days[9].hours[2]).toBe(10);
    const total = body.days
      .flatMap((d: { hours: (number | null)[] }) => d.hours)
      .reduce((s: number, g: number | null) => s + (g ?? 0), 0);
    expect(total).toBe(100);
  });

  it('when the monthly table is read, then use, budget, variance, cost and flags follow the hand sums', async () => {
    const body = (await manager.get(`/api/sites/${budgeted.id}/monthly?from=2025-05&to=2025-06`).expect(200)).body;
    const [may, jun] = body.months;
    expect(may).toMatchObject({ month: '2025-05', useGallons: 0 });
    expect(may.flags).toContain('no-data');
    expect([may.varianceGallons, may.percentOfBudget]).toEqual([null, null]);
    expect(jun.useGallons).toBeCloseTo(USE, 6);
    expect(jun.varianceGallons).toBeCloseTo(USE - BUDGET, 4);
    expect(jun.etoMm).toBeCloseTo(152.4, 6);
    expect(jun.cost).toBeCloseTo(20 + Math.round((USE / GAL_PER_CCF) * 4 * 100) / 100, 1);
    expect(jun.flags).toEqual(['over-budget']);
  });

  it(
    'when the monthly table is exported, then the CSV has units in ' +
      'its headers and the site name cannot run as a formula',
    async () => {
      const res = await manager.get(`/api/sites/${budgeted.id}/monthly?from=2025-06&to=2025-06&format=csv`).expect(200);
      expect(res.headers['content-type']).toMatch(/text\/csv/);
      expect(res.headers['content-disposition']).toMatch(
        /attachment; filename="Sum-Park-[a-f0-9]+-monthly-2025-06-to-2025-06\.csv"/,
      );
      const [header, row] = res.text.trim().split(/\r?\n/);
      expect(header).toBe(
        'Site,Month,Use (gal),Budget (gal),Variance (gal),Percent of budget (%),ETo (mm),Rain (mm),Cost,Currency,Flags',
      );
      expect(row!.startsWith(`'=Sum Park`)).toBe(true);
      expect(row).toContain(',2025-06,2880,');
    },
  );
});

describe('open alerts', () => {
  it(
    'when the site has one open and one resolved alert, then the ' + 'portfolio counts one and the overview marks both',
    async () => {
      const base = {
        kind: 'leak',
        subKind: 'night-flow',
        start: new Date('2025-06-10T09:00:00Z'),
        end: new Date('2025-06-10T13:00:00Z'),
      };
      for (const [status, key] of [
        ['open', `a-${suffix()}`],
        ['resolved', `b-${suffix()}`],
      ] as const) {
        await app.db.query(
          `INSERT INTO alert (site_id, kind, sub_kind, finding_key, condition_key, period_start_utc,
          period_end_utc, severity, status, evidence, explanation, first_detected_at, last_seen_at)
         VALUES (?, ?, ?, ?, ?, ?, ?, 'act-soon', ?, '{}', 'Water ran every night hour.', NOW(3), NOW(3))`,
          [unbudgeted.id, base.kind, base.subKind, key, key, base.start, base.end, status],
        );
      }
      const body = (await manager.get(`${june}&condition=open-alerts&organisationId=${owner.org.id}`).expect(200)).body;
      expect(body.alertsAvailable).toBe(true);
      expect(body.sites.items.map((r: { siteId: number; openAlerts: number }) => [r.siteId, r.openAlerts])).toEqual([
        [unbudgeted.id, 1],
      ]);
      const overview = (
        await manager.get(`/api/sites/${unbudgeted.id}/overview?from=2025-06-01&to=2025-06-30`).expect(200)
      ).body;
      expect(overview.alerts.map((a: { date: string; status: string }) => [a.date, a.status])).toEqual([
        ['2025-06-10', 'open'],
        ['2025-06-10', 'resolved'],
      ]);
      expect(overview.figures.openAlerts).toBe(1);
    },
  );
});

describe('cached monthly budgets follow their inputs', () => {
  // The site's monthly table reads the same cache as the portfolio (the portfolio also memoises its sums for
  // a few seconds, so it would lag by that much).
  it(
    'when a hydrozone is added, changed or removed after a month ' +
      'was cached, then the next read shows the new budget',
    async () => {
      const site = await createSite(app.db, owner.org.id, { name: `Cache ${suffix()}` });
      const stationId = await stationForSite(manager, site.id);
      await manager
        .postText(
          `/api/weather-stations/${stationId}/daily?format=eto-rain`,
          etoRainCsv('2025-06-01', 30, () => [5.08, 0]),
        )
        .expect(200);
      const budgetOf = async () => {
        const res = await manager.get(`/api/sites/${site.id}/monthly?from=2025-06&to=2025-06`).expect(200);
        return res.body.months[0].budgetGallons as number | null;
      };
      expect(await budgetOf()).toBeNull(); // no hydrozones yet: cached as "no budget"
      const zone = await manager
        .post(`/api/sites/${site.id}/hydrozones`, {
          name: 'Shrubs',
          area: 1000,
          areaUnit: 'ft2',
          plantFactor: 0.5,
          irrigationMethod: 'drip',
        })
        .expect(201);
      expect(await budgetOf()).toBeCloseTo(BUDGET, 0);
      await manager.patch(`/api/sites/${site.id}/hydrozones/${zone.body.id}`, { area: 2000 }).expect(200);
      expect(await budgetOf()).toBeCloseTo(2 * BUDGET, 0);
      await manager.delete(`/api/sites/${site.id}/hydrozones/${zone.body.id}`).expect(204);
      expect(await budgetOf()).toBeNull();
    },
  );
});
