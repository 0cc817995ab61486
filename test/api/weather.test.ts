import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { computeDailyEto } from '@shared/weather/daily-eto';
import { etoRainCsv, normals, stationForSite, TEST_STATION } from '../support/budget-fixtures';
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

let app: TestApp;
let owner: World;
let utility: World;
let stranger: World;
let manager: Client;
let site: { id: number };

beforeAll(async () => {
  app = await createTestApp();
  owner = await createWorld(app.db);
  utility = await createWorld(app.db, 'utility');
  stranger = await createWorld(app.db);
  manager = await signedIn(app, owner.users.manager.email);
  site = await createSite(app.db, owner.org.id);
  await shareSite(app.db, site.id, utility.org.id, 'read');
});
afterAll(async () => app?.stop());

const newStation = async () =>
  (await manager.post('/api/weather-stations', { name: `Station ${suffix()}`, ...TEST_STATION }).expect(201)).body
    .id as number;
const upload = (stationId: number, csv: string, format = 'eto-rain') =>
  manager.postText(`/api/weather-stations/${stationId}/daily?format=${format}`, csv);
const dayCount = async (stationId: number) =>
  (await manager.get(`/api/weather-stations/${stationId}`).expect(200)).body.dayCount as number;

describe('daily weather upload', () => {
  it('when the same file is uploaded twice, then the second upload changes nothing', async () => {
    const id = await newStation();
    const csv = etoRainCsv('2025-03-01', 31, (d) => [3 + Number(d.slice(8)) / 10, d.endsWith('05') ? 12.5 : 0]);
    const first = (await upload(id, csv).expect(200)).body;
    expect(first).toMatchObject({
      rows: 31,
      inserted: 31,
      updated: 0,
      unchanged: 0,
      from: '2025-03-01',
      to: '2025-03-31',
      gaps: [],
    });
    const second = (await upload(id, csv).expect(200)).body;
    expect(second).toMatchObject({ rows: 31, inserted: 0, updated: 0, unchanged: 31 });
    expect(await dayCount(id)).toBe(31);
    const series = (await manager.get(`/api/weather-stations/${id}/daily?from=2025-03-05&to=2025-03-05`).expect(200))
      .body;
    expect(series.days[0]).toMatchObject({
      date: '2025-03-05',
      etoMm: 3.5,
      rainMm: 12.5,
      method: 'measured',
      source: 'upload',
      filled: false,
    });
  });

  it('when a corrected file is uploaded, then changed days are updated in place', async () => {
    const id = await newStation();
    await upload(
      id,
      etoRainCsv('2025-04-01', 10, () => [4, 0]),
    ).expect(200);
    const report = (
      await upload(
        id,
        etoRainCsv('2025-04-01', 10, (d) => [d === '2025-04-03' ? 4.4 : 4, 0]),
      ).expect(200)
    ).body;
    expect(report).toMatchObject({ inserted: 0, updated: 1, unchanged: 9 });
  });

  it('when a day appears twice, then 400 names both rows and nothing is stored', async () => {
    const id = await newStation();
    const csv = 'date,eto_mm,rain_mm\n2025-05-01,4,0\n2025-05-02,4.1,0\n2025-05-02,4.2,0\n2025-05-03,4,0\n';
    const res = await upload(id, csv).expect(400);
    expect(res.body.error.details).toContainEqual({
      field: 'row 4.date',
      message: '2025-05-02 is already given on row 3',
    });
    expect(await dayCount(id)).toBe(0);
  });

  it('when one row has an impossible ETo among good ones, then 400 names that row and nothing is stored', async () => {
    const id = await newStation();
    const csv = 'date,eto_in,rain_in\n2025-05-01,0.2,0\n2025-05-02,1.2,0\n2025-05-03,0.2,-0.1\n';
    const res = await upload(id, csv).expect(400);
    const fields = res.body.error.details.map((d: { field: string }) => d.field);
    expect(fields).toEqual(['row 3.eto_in', 'row 4.rain_in']);
    expect(res.body.error.details[0].message).toMatch(/above 20 mm\/d/);
    expect(await dayCount(id)).toBe(0);
  });

  it(
    'when days are missing inside the file, then the gaps are reported ' + 'and, with normals, filled and flagged',
    async () => {
      const id = await newStation();
      const report = (
        await upload(
          id,
          etoRainCsv('2025-01-01', 31, () => [2, 1], ['2025-01-10', '2025-01-11', '2025-01-20']),
        ).expect(200)
      ).body;
      expect(report.gaps).toEqual([
        { from: '2025-01-10', to: '2025-01-11', days: 2 },
        { from: '2025-01-20', to: '2025-01-20', days: 1 },
      ]);
      const bare = (await manager.get(`/api/weather-stations/${id}/daily?from=2025-01-01&to=2025-01-31`).expect(200))
        .body;
      expect(bare.missingNormals).toEqual([1]);
      expect(bare.days).toHaveLength(28);
      await manager
        .put(`/api/weather-stations/${id}/normals`, { normals: normals({ etoMm: 62, rainMm: 31 }) })
        .expect(200);
      const filled = (await manager.get(`/api/weather-stations/${id}/daily?from=2025-01-01&to=2025-01-31`).expect(200))
        .body;
      expect(filled.filledDays).toBe(3);
      // January normal 62 mm ÷ 31 days = 2 mm/d ETo, 31 mm ÷ 31 = 1 mm/d rain.
      expect(filled.days.find((d: { date: string }) => d.date === '2025-01-10')).toMatchObject({
        etoMm: 2,
        rainMm: 1,
        filled: true,
        method: 'normal-filled',
        source: 'normals',
      });
    },
  );

  it('when the header is wrong, then 400 names the column on row 1', async () => {
    const id = await newStation();
    const res = await upload(id, 'day,eto_mm,rain_mm\n2025-05-01,4,0\n').expect(400);
    const fields = res.body.error.details.map((d: { field: string }) => d.field);
    expect(fields).toContain('row 1.day');
    expect(fields).toContain('row 1.date');
  });

  it(
    'when observations are uploaded, then ETo is computed and temperature-only ' + 'days are marked Hargreaves',
    async () => {
      const id = await newStation();
      const csv = [
        'date,tmax_c,tmin_c,rh_max_pct,rh_min_pct,wind_ms,solar_mj,rain_mm',
        '2025-07-06,21.5,12.3,84,63,2.78,22.07,0',
        '2025-07-07,30,15,,,,,0',
      ].join('\n');
      const report = (await upload(id, csv, 'observations').expect(200)).body;
      expect(report.methods).toEqual({ 'penman-monteith': 1, hargreaves: 1 });
      const days = (await manager.get(`/api/weather-stations/${id}/daily?from=2025-07-06&to=2025-07-07`).expect(200))
        .body.days;
      expect(days.map((d: { method: string }) => d.method)).toEqual(['penman-monteith', 'hargreaves']);
      for (const d of days) expect(d.etoMm).toBeGreaterThan(0);
    },
  );

  it('when an observation is out of physical bounds, then 400 names the row and column', async () => {
    const id = await newStation();
    const res = await upload(id, 'date,tmax_c,tmin_c,rh_min_pct\n2025-07-06,21.5,12.3,140\n', 'observations').expect(
      400,
    );
    expect(res.body.error.details[0].field).toBe('row 2.rh_min_pct');
  });
});

describe('invented sample files', () => {
  const sample = (path: string) => readFileSync(resolve(import.meta.dirname, '../../samples', path), 'utf8');

  it('when the good samples are uploaded, then every day is stored and the one missing day is reported', async () => {
    const id = await newStation();
    const metric = (await upload(id, sample('weather/daily-eto-rain.csv')).expect(200)).body;
    expect(metric).toMatchObject({ rows: 13, gaps: [{ from: '2026-03-11', to: '2026-03-11', days: 1 }] });
    const inches = (await upload(id, sample('weather/daily-eto-rain-inches.csv')).expect(200)).body;
    expect(inches.rows).toBe(5);
    // 0.24 in × 25.4 = 6.096 mm
    const june1 = (await manager.get(`/api/weather-stations/${id}/daily?from=2026-06-01&to=2026-06-01`).expect(200))
      .body.days[0];
    expect(june1.etoMm).toBeCloseTo(6.096, 9);
    const obs = (await upload(id, sample('weather/daily-observations.csv'), 'observations').expect(200)).body;
    expect(obs.methods).toEqual({ 'penman-monteith': 4, hargreaves: 1 });
  });

  it.each([
    ['broken/weather-duplicate-day.csv', ['row 4.date']],
    ['broken/weather-eto-out-of-bounds.csv', ['row 3.eto_mm', 'row 4.eto_mm']],
  ])('when %s is uploaded, then 400 names %j and nothing is stored', async (path, fields) => {
    const id = await newStation();
    const res = await upload(id, sample(path)).expect(400);
    expect(res.body.error.details.map((d: { field: string }) => d.field)).toEqual(fields);
    expect(await dayCount(id)).toBe(0);
  });
});

describe('weather feed', () => {
  it(
    'when January is fetched from the fake feed, then each returned ' +
      'day is stored with its computed ETo and missing days are reported',
    async () => {
      const id = await newStation();
      const report = (
        await manager.post(`/api/weather-stations/${id}/fetch`, { from: '2025-01-01', to: '2025-01-31' }).expect(200)
      ).body;
      // Ask the feed directly, as an independent reading of what it serves.
      const direct = (await (
        await fetch(
          `${app.config.weather.feedUrl}/daily-observations?lat=${TEST_STATION.latitude}` +
            `&lon=${TEST_STATION.longitude}&from=2025-01-01&to=2025-01-31`,
        )
      ).json()) as {
        days: {
          date: string;
          tempHighC: number;
          tempLowC: number;
          humidityHighPct: number;
          humidityLowPct: number;
          wind2mMs: number;
          solarMj: number;
          rainMm: number;
        }[];
      };
      expect(report.rows).toBe(direct.days.length);
      expect(report.inserted).toBe(direct.days.length);
      expect(report.gaps.reduce((s: number, g: { days: number }) => s + g.days, 0)).toBe(31 - direct.days.length);
      const stored = (await manager.get(`/api/weather-stations/${id}/daily?from=2025-01-01&to=2025-01-31`).expect(200))
        .body.days;
      const first = direct.days[0]!;
      const expected = computeDailyEto(
        {
          date: first.date,
          tMaxC: first.tempHighC,
          tMinC: first.tempLowC,
          rhMaxPct: first.humidityHighPct,
          rhMinPct: first.humidityLowPct,
          windSpeedMs: first.wind2mMs,
          windHeightM: 2,
          solarRadiationMj: first.solarMj,
        },
        { latitudeDeg: TEST_STATION.latitude, elevationM: TEST_STATION.elevationM },
      );
      const day = stored.find((d: { date: string }) => d.date === first.date);
      expect(day).toMatchObject({ source: 'feed', method: 'penman-monteith', rainMm: first.rainMm });
      expect(day.etoMm).toBeCloseTo(expected.etoMm, 9);
      const again = (
        await manager.post(`/api/weather-stations/${id}/fetch`, { from: '2025-01-01', to: '2025-01-31' }).expect(200)
      ).body;
      expect(again).toMatchObject({ inserted: 0, unchanged: direct.days.length });
    },
  );

  it('when the feed does not answer, then 502 says so and nothing is stored', async () => {
    const offline = await createTestApp({
      RILLMARK_WEATHER_FEED_URL: 'http://127.0.0.1:9',
      RILLMARK_WEATHER_FEED_TIMEOUT_MS: '2000',
    });
    try {
      const c = await signedIn(offline, owner.users.manager.email);
      const id = (await c.post('/api/weather-stations', { name: `Offline ${suffix()}`, ...TEST_STATION }).expect(201))
        .body.id;
      const res = await c
        .post(`/api/weather-stations/${id}/fetch`, { from: '2025-01-01', to: '2025-01-05' })
        .expect(502);
      expect(res.body.error.code).toBe('upstream_unavailable');
      expect((await c.get(`/api/weather-stations/${id}`).expect(200)).body.dayCount).toBe(0);
    } finally {
      await offline.stop();
    }
  });
});

describe('station access and normals', () => {
  it(
    'when a site is linked, then an auditor who sees the site sees ' +
      'the station but cannot change it; strangers get 404',
    async () => {
      const id = await stationForSite(manager, site.id);
      const auditor = await signedIn(app, utility.users.auditor.email);
      expect((await auditor.get(`/api/weather-stations/${id}`).expect(200)).body.canEdit).toBe(false);
      expect((await auditor.get(`/api/sites/${site.id}/weather-station`).expect(200)).body.station.id).toBe(id);
      await auditor
        .postText(`/api/weather-stations/${id}/daily?format=eto-rain`, 'date,eto_mm,rain_mm\n2025-01-01,1,0\n')
        .expect(403);
      await auditor.put(`/api/sites/${site.id}/weather-station`, { stationId: null }).expect(403);
      const outsider = await signedIn(app, stranger.users.admin.email);
      await outsider.get(`/api/weather-stations/${id}`).expect(404);
      expect(
        (await outsider.get('/api/weather-stations?pageSize=200').expect(200)).body.items.map(
          (s: { id: number }) => s.id,
        ),
      ).not.toContain(id);
      await outsider.put(`/api/sites/${site.id}/weather-station`, { stationId: id }).expect(404);
    },
  );

  it('when normals miss a month or exceed bounds, then 400 names them', async () => {
    const id = await newStation();
    const eleven = normals({ etoMm: 100, rainMm: 10 }).slice(0, 11);
    expect(
      (await manager.put(`/api/weather-stations/${id}/normals`, { normals: eleven }).expect(400)).body.error.details[0]
        .field,
    ).toBe('normals');
    const wild = normals({ etoMm: 100, rainMm: 10 }, { 6: { etoMm: 900, rainMm: 0 } });
    expect(
      (await manager.put(`/api/weather-stations/${id}/normals`, { normals: wild }).expect(400)).body.error.details[0]
        .field,
    ).toBe('normals.5.etoMm');
  });
});
