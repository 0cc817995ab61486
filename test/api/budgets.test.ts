import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { etoRainCsv, normals, stationForSite } from '../support/budget-fixtures';
import {
  createSite,
  createTestApp,
  createWorld,
  signedIn,
  type Client,
  type TestApp,
  type World,
} from '../support/test-app';

/**
 * A small invented site worked by hand. Formulas: MWELO (2015) App. B — ETo × PF × area × conversion ÷ IE,
 * IE 0.81 drip / 0.75 overhead spray (note c), MAWA note e, ETWU note d; 1 in over 1 ft² = 144/231 gal
 * (docs/references.md §3 and §5); 1 ft² = 0.09290304 m² (NIST); CCF = 100 ft³ = 748.0519 gal;
 * PR = 96.25 × gpm ÷ area (docs/references.md §4).
 */
const GAL_PER_IN_FT2 = 144 / 231;
const FT2_PER_M2 = 1 / 0.09290304;
const GAL_PER_CCF = 100 * (1728 / 231);

let app: TestApp;
let world: World;
let manager: Client;
let siteId: number;
let shrubId: number;

beforeAll(async () => {
  app = await createTestApp();
  world = await createWorld(app.db);
  manager = await signedIn(app, world.users.manager.email);
  siteId = (await createSite(app.db, world.org.id, { kind: 'park' })).id;
  // Shrubs: 1,000 ft², PF 0.5 entered, drip (IE 0.81), 100 emitters × 1 gph.
  shrubId = (
    await manager
      .post(`/api/sites/${siteId}/hydrozones`, {
        name: 'Shrub bed',
        area: 1000,
        areaUnit: 'ft2',
        plantFactor: 0.5,
        irrigationMethod: 'drip',
        emitterCount: 100,
        emitterGph: 1,
      })
      .expect(201)
  ).body.id;
  // Turf: 100 m² entered in metric, "high" category (default PF 0.85), rotors (IE 0.75), recreation turf SLA.
  await manager
    .post(`/api/sites/${siteId}/hydrozones`, {
      name: 'Play lawn',
      area: 100,
      areaUnit: 'm2',
      plantWaterUse: 'high',
      irrigationMethod: 'rotor',
      specialLandscapeArea: true,
      specialLandscapeKind: 'recreation-turf',
    })
    .expect(201);
  const stationId = await stationForSite(manager, siteId);
  await manager
    .put(`/api/weather-stations/${stationId}/normals`, {
      normals: normals({ etoMm: 150, rainMm: 20 }, { 7: { etoMm: 186, rainMm: 0 } }),
    })
    .expect(200);
  // June 2025: 5.08 mm (0.2 in) every day, no rain. July: 6 mm a day, 8 mm of rain on the 10th, the 15th missing.
  await manager
    .postText(
      `/api/weather-stations/${stationId}/daily?format=eto-rain`,
      etoRainCsv('2025-06-01', 30, () => [5.08, 0]),
    )
    .expect(200);
  await manager
    .postText(
      `/api/weather-stations/${stationId}/daily?format=eto-rain`,
      etoRainCsv('2025-07-01', 31, (d) => [6, d === '2025-07-10' ? 8 : 0], ['2025-07-15']),
    )
    .expect(200);
  await manager
    .post(`/api/sites/${siteId}/rate-schedules`, {
      name: 'Irrigation uniform',
      unit: 'ccf',
      fixedChargePerPeriod: 20,
      volumeCharge: { kind: 'uniform', pricePerUnit: 4 },
      effectiveFrom: '2025-01-01',
    })
    .expect(201);
});
afterAll(async () => app?.stop());

describe('site budget', () => {
  it('when June has 6.0 in of ETo and no rain, then each hydrozone budget matches the hand calculation', async () => {
    const res = await manager.get(`/api/sites/${siteId}/budget?from=2025-06&to=2025-06`).expect(200);
    const june = res.body.months[0];
    expect(june.month).toBe('2025-06');
    expect(june.etoMm).toBeCloseTo(152.4, 6);
    expect(june.filledDays).toBe(0);
    const shrub = june.zones.find((z: { zoneName: string }) => z.zoneName === 'Shrub bed');
    const lawn = june.zones.find((z: { zoneName: string }) => z.zoneName === 'Play lawn');
    // 6.0 in × 0.5 × 1,000 ft² × 144/231 ÷ 0.81 = 2,308.80 gal
    expect(shrub.gallons).toBeCloseTo((6.0 * 0.5 * 1000 * GAL_PER_IN_FT2) / 0.81, 6);
    expect(shrub.gallons).toBeCloseTo(2308.8, 1);
    // 6.0 in × 0.85 × 1,076.39 ft² × 144/231 ÷ 0.75; in metric 152.4 mm × 0.85 × 100 m² ÷ 0.75 = 17,272 L
    expect(lawn.areaFt2).toBeCloseTo(100 * FT2_PER_M2, 6);
    expect(lawn.gallons).toBeCloseTo((6.0 * 0.85 * 100 * FT2_PER_M2 * GAL_PER_IN_FT2) / 0.75, 6);
    expect(lawn.litres).toBeCloseTo(17272, 6);
    expect(june.gallons).toBeCloseTo(shrub.gallons + lawn.gallons, 6);
    // The "how computed" lines carry the same numbers a person would write down.
    const gross = shrub.steps.find((s: { label: string }) => s.label === 'Gross irrigation');
    expect(gross.formula).toContain('6.000 in × 0.50 × 1,000 ft²');
    expect(gross.formula).toContain('÷ 0.81');
  });

  it('when a uniform rate applies, then the budget cost is the fixed charge plus CCF × price', async () => {
    const june = (await manager.get(`/api/sites/${siteId}/budget?from=2025-06&to=2025-06`).expect(200)).body.months[0];
    const ccf = june.gallons / GAL_PER_CCF;
    expect(june.cost.units).toBeCloseTo(ccf, 6);
    expect(june.cost.total).toBeCloseTo(Math.round((20 + 4 * ccf) * 100) / 100, 2);
  });

  it(
    "when the meter also serves 10 people at 50 gal a day, then June's " + 'cost covers landscape + 15,000 gal indoor',
    async () => {
      const june = (
        await manager
          .get(`/api/sites/${siteId}/budget?from=2025-06&to=2025-06&occupants=10&gallonsPerPersonPerDay=50`)
          .expect(200)
      ).body.months[0];
      expect(june.indoorGallons).toBe(10 * 50 * 30);
      const ccf = (june.gallons + 15000) / GAL_PER_CCF;
      expect(june.cost.total).toBeCloseTo(Math.round((20 + 4 * ccf) * 100) / 100, 2);
      const half = await manager.get(`/api/sites/${siteId}/budget?from=2025-06&to=2025-06&occupants=10`).expect(400);
      expect(half.body.error.details[0].field).toBe('occupants');
    },
  );

  it(
    'when July misses a day and 25 % of rain is credited, then the ' +
      'day is filled from normals and flagged, and the credit is hand-checkable',
    async () => {
      const res = await manager
        .get(`/api/sites/${siteId}/budget?from=2025-06&to=2025-07&rain=fixed-fraction&rainValue=0.25`)
        .expect(200);
      const july = res.body.months[1];
      expect(july.filledDays).toBe(1);
      expect(july.methods).toEqual(expect.arrayContaining(['measured', 'normal-filled']));
      // 30 measured days at 6 mm + the 15th from the July normal 186 mm ÷ 31 = 6 mm → 186 mm.
      expect(july.etoMm).toBeCloseTo(186, 6);
      const shrub = july.zones.find((z: { zoneName: string }) => z.zoneName === 'Shrub bed');
      // Effective rain 0.25 × 8 mm = 2 mm, below that day's need 6 × 0.5 = 3 mm, so no day floors at zero.
      const netIn = (186 * 0.5 - 2) / 25.4;
      expect(shrub.gallons).toBeCloseTo((netIn * 1000 * GAL_PER_IN_FT2) / 0.81, 6);
      expect(shrub.rainCreditGallons).toBeCloseTo(((2 / 25.4) * 1000 * GAL_PER_IN_FT2) / 0.81, 6);
      expect(res.body.totals.filledDays).toBe(1);
      expect(res.body.rainCredit.description).toMatch(/25 %/);
    },
  );

  it('when the range or the rain credit is nonsense, then 400 names the field', async () => {
    const bad = await manager.get(`/api/sites/${siteId}/budget?from=2025-13&to=2025-06`).expect(400);
    expect(bad.body.error.details[0].field).toBe('from');
    const backwards = await manager.get(`/api/sites/${siteId}/budget?from=2025-07&to=2025-06`).expect(400);
    expect(backwards.body.error.details[0].field).toBe('to');
    const fraction = await manager
      .get(`/api/sites/${siteId}/budget?from=2025-06&to=2025-06&rain=fixed-fraction&rainValue=3`)
      .expect(400);
    expect(fraction.body.error.details[0].field).toBe('rainValue');
  });

  it(
    'when a month has missing days and no normals, then days near measured ones are estimated, the rest left ' +
      'out (the month partial with the budget for the days it covers), until a nearby station can stand in',
    async () => {
      // An organisation of its own, so no other station of it is near.
      const own = await createWorld(app.db);
      const ownManager = await signedIn(app, own.users.manager.email);
      const other = (await createSite(app.db, own.org.id)).id;
      await ownManager
        .post(`/api/sites/${other}/hydrozones`, {
          name: 'Bed',
          area: 500,
          areaUnit: 'ft2',
          plantFactor: 0.3,
          irrigationMethod: 'drip',
        })
        .expect(201);
      const stationId = await stationForSite(ownManager, other);
      await ownManager
        .postText(
          `/api/weather-stations/${stationId}/daily?format=eto-rain`,
          etoRainCsv('2025-06-01', 20, () => [5, 0]),
        )
        .expect(200);
      const res = await ownManager.get(`/api/sites/${other}/budget?from=2025-06&to=2025-06`).expect(200);
      const [june] = res.body.months;
      // June 21–25 have at least three measured days within a week: estimated. June 26–30 have not: left out.
      expect(june).toMatchObject({ month: '2025-06', days: 25, partial: true, estimatedDays: 5 });
      expect(june.missingDates).toEqual(['2025-06-26', '2025-06-27', '2025-06-28', '2025-06-29', '2025-06-30']);
      // 25 days × 5 mm × 0.3 × 500 ft² × 144/231 gal/(in·ft²) ÷ 0.81 ÷ 25.4 mm/in (MWELO App. B form)
      expect(june.gallons).toBeCloseTo((25 * 5 * 0.3 * 500 * (144 / 231)) / 0.81 / 25.4, 6);
      const daily = june.daily as { gallons: number; estimated: boolean }[];
      expect(daily.reduce((s, d) => s + d.gallons, 0)).toBeCloseTo(june.gallons, 6);
      expect(daily.filter((d) => d.estimated)).toHaveLength(5);
      // Annual compliance still needs every day of the year: it says the weather is incomplete.
      const compliance = await ownManager.get(`/api/sites/${other}/compliance?year=2025`).expect(400);
      expect(compliance.body.error.message).toMatch(/incomplete/);

      // A second station of the organisation 5 km away has the last days: they stand in, flagged estimated.
      const near = await ownManager
        .post('/api/weather-stations', { name: 'Ridge gauge', latitude: 36.465, longitude: -119.87, elevationM: 110 })
        .expect(201);
      await ownManager
        .postText(
          `/api/weather-stations/${near.body.id}/daily?format=eto-rain`,
          etoRainCsv('2025-06-26', 5, () => [6, 0]),
        )
        .expect(200);
      const filled = (await ownManager.get(`/api/sites/${other}/budget?from=2025-06&to=2025-06`).expect(200)).body;
      expect(filled.months[0]).toMatchObject({ days: 30, partial: false, estimatedDays: 10, missingDates: [] });
      expect(filled.sources.join(' ')).toContain('Ridge gauge');
    },
  );

  it('when the site has no hydrozones or no station, then 400 says what to add', async () => {
    const bare = (await createSite(app.db, world.org.id)).id;
    const res = await manager.get(`/api/sites/${bare}/budget?from=2025-06&to=2025-06`).expect(400);
    expect(res.body.error.details[0].field).toBe('hydrozones');
    await manager
      .post(`/api/sites/${bare}/hydrozones`, {
        name: 'Bed',
        area: 500,
        areaUnit: 'ft2',
        plantFactor: 0.3,
        irrigationMethod: 'drip',
      })
      .expect(201);
    const noStation = await manager.get(`/api/sites/${bare}/budget?from=2025-06&to=2025-06`).expect(400);
    expect(noStation.body.error.details[0].field).toBe('weatherStation');
  });
});

describe('MWELO compliance', () => {
  it(
    'when the shrubs run at ETAF 0.62 on a non-residential site, ' +
      'then MAWA and ETWU match App. B and it does not comply',
    async () => {
      const res = await manager.get(`/api/sites/${siteId}/compliance?year=2025`).expect(200);
      const c = res.body;
      // ETo for 2025: ten months of normals at 150 mm + June 152.4 mm + July 186 mm.
      const etoIn = (10 * 150 + 152.4 + 186) / 25.4;
      const la = 1000 + 100 * FT2_PER_M2;
      const sla = 100 * FT2_PER_M2;
      expect(c.projectType).toBe('non-residential');
      expect(c.etoIn).toBeCloseTo(etoIn, 6);
      expect(c.mawaGallons).toBeCloseTo(etoIn * 0.62 * (0.45 * la + 0.55 * sla), 4);
      expect(c.etwuGallons).toBeCloseTo(etoIn * 0.62 * ((0.5 / 0.81) * 1000 + 1.0 * sla), 4);
      expect(c.regularAreaEtaf).toBeCloseTo(0.5 / 0.81, 9);
      expect(c.complies).toBe(false);
      expect(c.reasons.join(' ')).toMatch(/ETAF 0\.62 exceeds the maximum 0\.45/);
    },
  );

  it('when residential is chosen, then the 0.55 ETAF is used', async () => {
    const c = (await manager.get(`/api/sites/${siteId}/compliance?year=2025&projectType=residential`).expect(200)).body;
    expect(c.maxEtaf).toBe(0.55);
    expect(c.projectTypeSource).toMatch(/request/);
  });
});

describe('run-time advice', () => {
  it(
    'when a drip zone has 100 × 1 gph emitters, then PR, minutes ' +
      'and the safety cautions follow the hand calculation',
    async () => {
      const res = await manager
        .get(`/api/sites/${siteId}/hydrozones/${shrubId}/advice?month=2025-06&daysPerWeek=3`)
        .expect(200);
      const flow = (100 * 1) / 60;
      const pr = (96.25 * flow) / 1000;
      const weeklyIn = ((6.0 * 0.5) / 0.81) * (7 / 30);
      expect(res.body.flowGpm).toBeCloseTo(flow, 9);
      expect(res.body.prInPerHour).toBeCloseTo(pr, 9);
      expect(res.body.weeklyDepthIn).toBeCloseTo(weeklyIn, 9);
      expect(res.body.minutesPerWeek).toBeCloseTo((weeklyIn / pr) * 60, 6);
      expect(res.body.minutesPerWateringDay).toBeCloseTo((weeklyIn / pr) * 20, 6);
      const cautions = res.body.cautions.join(' ');
      expect(cautions).toMatch(/pressure regulator \(around 25–30 psi\)/);
      expect(cautions).toMatch(/filter/);
      expect(cautions).toMatch(/[Bb]ackflow/);
      expect(cautions).toMatch(/licensed professionals/);
    },
  );

  it('when a zone has no flow entered, then 400 names the design flow field', async () => {
    const lawn = (await manager.get(`/api/sites/${siteId}/hydrozones?q=Play`).expect(200)).body.items[0];
    const res = await manager.get(`/api/sites/${siteId}/hydrozones/${lawn.id}/advice?month=2025-06`).expect(400);
    expect(res.body.error.details[0].field).toBe('designFlowGpm');
  });
});
