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
    `INSERT INTO meter (site_id, ref, unit, register_multiplier, purpose, water_source) VALUES (?,
      ?, 'gal', 1, 'dedicated-irrigation', 'recycled')`,
    [site.id, `M-${suffix()}`],
  );
  const [upload] = await app.db.query(
    `INSERT INTO upload (site_id, file_name, status) VALUES (?, 'test.csv', 'done') RETURNING id`,
    [site.id],
  );
  const start = Date.parse(fromUtc);
  const rows = Array.from({ length: hours }, (_, h) => [
    meter.insertId,
    new Date(start + h * 3_600_000),
    60,
    gallonsPerHour,
    gallonsPerHour,
    'gal',
    upload.id,
  ]);
  await app.db.query(
    `INSERT INTO meter_reading (meter_id, start_utc, minutes, volume_gal, original_value,
      original_unit, upload_id) VALUES ?`,
    [rows],
  );
  return { siteId: site.id, start: new Date(start), end: new Date(start + hours * 3_600_000) };
}

describe('daily use rollup', () => {
  it('when readings span the fall-back night, then that local day holds 25 hours and its neighbours 24', async () => {
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

  it(
    'when readings are removed and the range refreshed, then the ' + 'rollup follows; monthly sums add up the days',
    async () => {
      const { siteId, start, end } = await meterWithHourlyReadings('America/Denver', '2026-05-31T06:00:00Z', 48, 5);
      await app.db.transaction((em) => rollup.refresh(em, siteId, start, end));
      expect(await rollup.monthly([siteId], '2026-05-01', '2026-06-30')).toEqual([
        {
          siteId,
          month: '2026-05',
          gallons: 120,
          coveredMinutes: 1440,
          days: 1,
          estimatedGallons: 0,
          spreadGallons: 0,
        },
        {
          siteId,
          month: '2026-06',
          gallons: 120,
          coveredMinutes: 1440,
          days: 1,
          estimatedGallons: 0,
          spreadGallons: 0,
        },
      ]);
      await app.db.query(
        'DELETE r FROM meter_reading r JOIN meter m ON m.id = r.meter_id WHERE m.site_id = ? AND r.start_utc >= ?',
        [siteId, new Date('2026-06-01T06:00:00Z')],
      );
      await app.db.transaction((em) => rollup.refresh(em, siteId, start, end));
      expect((await rollup.daily(siteId, '2026-05-01', '2026-06-30')).map((d) => d.localDate)).toEqual(['2026-05-31']);
      // The monthly rollup followed in the same refresh: June is gone from it too.
      const months: { month: string; gallons: string; days: number }[] = await app.db.query(
        'SELECT month, gallons, days FROM site_monthly_use WHERE site_id = ? ORDER BY month',
        [siteId],
      );
      expect(months.map((m) => ({ month: m.month, gallons: Number(m.gallons), days: Number(m.days) }))).toEqual([
        { month: '2026-05', gallons: 120, days: 1 },
      ]);
    },
  );

  it(
    'when a range has whole months and partial ones at its edges, ' +
      'then monthly use reads the monthly rollup for the whole months ' +
      'and days for the rest, adding up like the days',
    async () => {
      // Hourly 2 gal from 2026-03-10 to 2026-06-20 local (Los Angeles, across the spring-forward night).
      const { siteId, start, end } = await meterWithHourlyReadings(
        'America/Los_Angeles',
        '2026-03-10T08:00:00Z',
        24 * 102,
        2,
      );
      await app.db.transaction((em) => rollup.refresh(em, siteId, start, end));
      const fromDays = async (from: string, to: string) => {
        const byMonth = new Map<string, { gallons: number; coveredMinutes: number; days: number }>();
        for (const d of await rollup.daily(siteId, from, to)) {
          const m = byMonth.get(d.localDate.slice(0, 7)) ?? { gallons: 0, coveredMinutes: 0, days: 0 };
          byMonth.set(d.localDate.slice(0, 7), {
            gallons: m.gallons + d.gallons,
            coveredMinutes: m.coveredMinutes + d.coveredMinutes,
            days: m.days + 1,
          });
        }
        return [...byMonth].map(([month, m]) => ({ siteId, month, ...m, estimatedGallons: 0, spreadGallons: 0 }));
      };
      for (const [from, to] of [
        ['2026-03-01', '2026-06-30'],
        ['2026-03-15', '2026-05-31'],
        ['2026-04-01', '2026-06-10'],
        ['2026-03-20', '2026-06-05'],
        ['2026-04-03', '2026-04-27'],
        ['2026-03-25', '2026-04-05'],
      ] as const) {
        expect(await rollup.monthly([siteId], from, to), `${from}..${to}`).toEqual(await fromDays(from, to));
      }
      // Whole April: 30 local days × 48 gal.
      expect((await rollup.monthly([siteId], '2026-04-01', '2026-04-30'))[0]).toMatchObject({
        month: '2026-04',
        gallons: 30 * 48,
        days: 30,
      });
    },
  );
});
