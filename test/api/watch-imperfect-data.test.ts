import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { etoRainCsv, stationForSite } from '../support/budget-fixtures';
import {
  createSite,
  createTestApp,
  createWorld,
  signedIn,
  type Client,
  type TestApp,
  type World,
} from '../support/test-app';
import { addHours, addMeter, HOUR, runWatch } from './watch-fixtures';

let app: TestApp;
let world: World;
let admin: Client;
let manager: Client;
let siteId: number;
let stationName: string;

const DAY = 24 * HOUR;
const MAY = Date.UTC(2025, 4, 1);
const JULY = Date.UTC(2025, 6, 1);

/**
 * A site over budget in May and June 2025 (300 gal every evening against a budget near 130 gal a day), whose
 * station has no weather for May 31 and no monthly normals.
 */
beforeAll(async () => {
  app = await createTestApp();
  world = await createWorld(app.db);
  admin = await signedIn(app, world.users.admin.email);
  manager = await signedIn(app, world.users.manager.email);
  siteId = (await createSite(app.db, world.org.id, { timeZone: 'UTC' })).id;
  // 1,000 ft² of turf, PF 0.8, rotors (IE 0.75): 5 mm/day → 5 ÷ 25.4 × 0.8 × 1,000 × 0.623377 ÷ 0.75 ≈ 131 gal/day.
  await manager
    .post(`/api/sites/${siteId}/hydrozones`, {
      name: 'Front turf',
      area: 1000,
      areaUnit: 'ft2',
      plantFactor: 0.8,
      irrigationMethod: 'rotor',
    })
    .expect(201);
  const stationId = await stationForSite(manager, siteId);
  stationName = (await manager.get(`/api/weather-stations/${stationId}`).expect(200)).body.name;
  await manager
    .postText(
      `/api/weather-stations/${stationId}/daily?format=eto-rain`,
      etoRainCsv('2025-05-01', 61, (d) => [Number(d.slice(8)) % 2 ? 4 : 6, 0], ['2025-05-31']),
    )
    .expect(200);
  const meterId = await addMeter(app.db, siteId);
  for (let day = MAY; day < JULY; day += DAY) await addHours(app.db, meterId, day + 22 * HOUR, day + 23 * HOUR, 300);
}, 60_000);
afterAll(async () => app?.stop());

describe('the watch on imperfect weather', () => {
  it(
    'when weather is missing for the last day of May and there are no normals, then both over months are ' +
      'flagged, one alert each, the run says which site-months were estimated, and the station gets one alert',
    async () => {
      const run = await runWatch(admin, {
        from: new Date(Date.UTC(2025, 5, 1)).toISOString(),
        to: new Date(JULY + 12 * HOUR).toISOString(),
        siteId,
      });
      expect(run).toMatchObject({ status: 'done', sitesChecked: 1, sitesTotal: 1, sitesDone: 1, errors: [] });
      expect(run.warnings).toContainEqual(
        expect.objectContaining({
          siteId,
          message: expect.stringMatching(/budget for 2025-05 1 day\(s\) of weather estimated/),
        }),
      );
      const alerts: {
        kind: string;
        sub_kind: string;
        condition_key: string;
        first_detected_at: Date;
        explanation: string;
      }[] = await app.db.query(
        `SELECT kind, sub_kind, condition_key, first_detected_at, explanation FROM alert
          WHERE site_id = ? ORDER BY period_start_utc`,
        [siteId],
      );
      const overspend = alerts.filter((a) => a.kind === 'overspend');
      expect(overspend.map((a) => a.condition_key.split('|').pop())).toEqual(['2025-05', '2025-06']);
      expect(overspend.every((a) => a.sub_kind === 'calendar-month')).toBe(true);
      // The re-check files each at the night it was first detectable, as a nightly job would have.
      expect(overspend[0]!.first_detected_at.getTime()).toBeLessThan(Date.UTC(2025, 4, 10));
      expect(overspend[0]!.explanation).toMatch(/1 day of its weather were estimated/);
      const weather = alerts.filter((a) => a.kind === 'weather');
      expect(weather).toHaveLength(1);
      expect(weather[0]!.explanation).toContain(`"${stationName}" is missing ETo or rain for 2025-05-31 (1 day)`);
      // No alert text names a database id.
      for (const a of alerts) expect(a.explanation).not.toMatch(/zones? \d|Zone \d/);

      const again = await runWatch(admin, {
        from: new Date(Date.UTC(2025, 5, 1)).toISOString(),
        to: new Date(JULY + 12 * HOUR).toISOString(),
        siteIds: [siteId],
      });
      expect(again.alertsRaised).toBe(0);
    },
  );

  it("when the overview draws June's daily budget, then it follows each day's ETo and sums to the month", async () => {
    const overview = (await manager.get(`/api/sites/${siteId}/overview?from=2025-06-01&to=2025-06-30`).expect(200))
      .body;
    const budget = (await manager.get(`/api/sites/${siteId}/budget?from=2025-06&to=2025-06`).expect(200)).body;
    const days = overview.days as { date: string; budgetGallons: number }[];
    expect(days.reduce((s, d) => s + d.budgetGallons, 0)).toBeCloseTo(budget.months[0].gallons, 6);
    // Odd days had 4 mm of ETo, even days 6 mm: the line is not flat.
    expect(days[1]!.budgetGallons / days[0]!.budgetGallons).toBeCloseTo(1.5, 6);
  });

  it("when a run names another organisation's site, then it does not exist (404); a manager may not run", async () => {
    const other = await createWorld(app.db);
    const foreign = (await createSite(app.db, other.org.id)).id;
    await admin.post('/api/watch/runs', { siteId: foreign }).expect(404);
    await manager.post('/api/watch/runs', { siteId }).expect(403);
  });
});
