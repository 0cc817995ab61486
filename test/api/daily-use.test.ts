import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DailyUseRepository } from '../../backend/src/components/readings/data/daily-use-repository';
import { createOrganisation, createSite, createTestApp, suffix, type TestApp } from '../support/test-app';

let app: TestApp;
let rollup: DailyUseRepository;

beforeAll(async () => {
  app = await createTestApp();
  rollup = new DailyUseRepository(app.db);
});
afterAll(async () => app?.stop());

async function meterWithHourlyReadings(timeZone: string, fromUtc: string, hours: number, gallonsPerHour = 10) {
  const org = await createOrganisation(app.db);
  const site = await createSite(app.db, org.id, { timeZone });
  const meter = await app.db.query(
    `INSERT INTO meter (site_id, ref, unit, register_multiplier, purpose, water_source) VALUES (?, ?, 'gal', 1, 'dedicated-irrigation', 'recycled')`,
    [site.id, `M-${suffix()}`],
  );
  const [upload] = await app.db.query(`INSERT INTO upload (site_id, file_name, status) VALUES (?, 'test.csv', 'done') RETURNING id`, [site.id]);
  const start = Date.parse(fromUtc);
  const rows = Array.from({ length: hours }, (_, h) => [meter.insertId, new Date(start + h * 3_600_000), 60, gallonsPerHour, gallonsPerHour, 'gal', upload.id]);
  await app.db.query('INSERT INTO meter_reading (meter_id, start_utc, minutes, volume_gal, original_value, original_unit, upload_id) VALUES ?', [rows]);
  return { siteId: site.id, start: new Date(start), end: new Date(start + hours * 3_600_000) };
}

describe('daily use rollup', () => {
  it("when readings span the fall-back night, then that local day holds 25 hours and its neighbours 24", async () => {
    // 2026-10-31 00:00 PDT = 07:00 UTC; three local days: 24 h, 25 h (clocks go back on 1 Nov), 24 h = 73 hours.
    const { siteId, start, end } = await meterWithHourlyReadings('America/Los_Angeles', '2026-10-31T07:00:00Z', 73);
    await app.db.transaction((em) => rollup.refresh(em, siteId, start, end));
    const days = await rollup.daily(siteId, '2026-10-30', '2026-11-03');
    expect(days.map((d) => [d.localDate, d.readingCount, d.gallons])).toEqual([
      ['2026-10-31', 24, 240],
      ['2026-11-01', 25, 250],
      ['2026-11-02', 24, 240],
    ]);
  });

  it('when the site is in Phoenix (no daylight saving), then every local day has 24 hours', async () => {
    const { siteId, start, end } = await meterWithHourlyReadings('America/Phoenix', '2026-03-07T07:00:00Z', 72);
    await app.db.transaction((em) => rollup.refresh(em, siteId, start, end));
    const days = await rollup.daily(siteId, '2026-03-01', '2026-03-31');
    expect(days.map((d) => d.readingCount)).toEqual([24, 24, 24]);
  });

  it('when readings are removed and the range refreshed, then the rollup follows; monthly sums add up the days', async () => {
    const { siteId, start, end } = await meterWithHourlyReadings('America/Denver', '2026-05-31T06:00:00Z', 48, 5);
    await app.db.transaction((em) => rollup.refresh(em, siteId, start, end));
    expect(await rollup.monthly([siteId], '2026-05-01', '2026-06-30')).toEqual([
      { siteId, month: '2026-05', gallons: 120, coveredMinutes: 1440, days: 1 },
      { siteId, month: '2026-06', gallons: 120, coveredMinutes: 1440, days: 1 },
    ]);
    await app.db.query('DELETE r FROM meter_reading r JOIN meter m ON m.id = r.meter_id WHERE m.site_id = ? AND r.start_utc >= ?', [siteId, new Date('2026-06-01T06:00:00Z')]);
    await app.db.transaction((em) => rollup.refresh(em, siteId, start, end));
    expect((await rollup.daily(siteId, '2026-05-01', '2026-06-30')).map((d) => d.localDate)).toEqual(['2026-05-31']);
  });
});
