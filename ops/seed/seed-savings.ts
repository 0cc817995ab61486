import type { DataSource } from 'typeorm';
import { zoneOffsetMinutes } from '@shared/ingest/zoned-time';
import { DailyUseRepository } from '../../backend/src/components/readings/data/daily-use-repository';
import { MeterEntity } from '../../backend/src/components/meters/data/meter.entity';
import { OrganisationEntity } from '../../backend/src/components/organisations/data/organisation.entity';
import { SavingsProjectEntity } from '../../backend/src/components/savings/data/savings-project.entity';
import { SiteEntity } from '../../backend/src/components/sites/data/site.entity';
import { UserEntity } from '../../backend/src/components/users/data/user.entity';
import { DEMO_ORGANISATIONS, DEMO_USERS } from './demo-scenario';

const SITE = 'Willowmere HOA — South Greenbelt';
const METER_REF = 'HOA-SOUTH-01';
const FILE_NAME = 'south-greenbelt-daily-2025-04-to-2026-11.csv';
const FROM = '2025-04-01';
const TO = '2026-11-30';
const INSTALLED_ON = '2026-04-14';
/** gal per mm of ETo: greenbelt spray 12,600 ft² × PF 0.5 ÷ IE 0.75 plus the slope, × 0.02454 gal per mm·ft². */
const SPRAY_GAL_PER_MM = 273;
/** After the retrofit the greenbelt runs on drip with a lower plant factor: about 29 % less per mm of ETo. */
const DRIP_GAL_PER_MM = 195;
const BASE_GAL_PER_DAY = 40;
const RETROFITS = [
  'Greenbelt path, zones 3–7: 212 spray heads capped; inline drip (0.6 gph emitters, 12 in spacing) under mulch',
  'Pressure-regulating filter assembly (30 psi) at each converted valve',
  'Flush caps at the end of every drip lateral',
  'Controller programs for zones 3–7 rewritten for drip run times',
];

/**
 * The demo retrofit: a year of baseline and a season after on South Greenbelt, as invented daily meter readings
 * driven by the station's ETo (spray before 2026-04-14, drip after), then the daily rollup and a savings project.
 * Idempotent: the upload row is matched by file name, the project by title; the generator is seeded, so the
 * report's figures are the same on every machine.
 */
export async function seedSavings(db: DataSource): Promise<{ readings: number; projects: number }> {
  const org = await db
    .getRepository(OrganisationEntity)
    .findOneByOrFail({ name: DEMO_ORGANISATIONS.find((o) => o.key === 'cobalt')!.name });
  const site = await db.getRepository(SiteEntity).findOneByOrFail({ organisationId: org.id, name: SITE });
  const contractorEmail = DEMO_USERS.find((u) => u.organisation === 'thistlewood' && u.role === 'contractor')?.email;
  const author = contractorEmail ? await db.getRepository(UserEntity).findOneBy({ email: contractorEmail }) : null;
  let readings = 0;
  const [existing]: { id: number }[] = await db.query('SELECT id FROM upload WHERE site_id = ? AND file_name = ?', [
    site.id,
    FILE_NAME,
  ]);
  if (!existing) {
    if (!site.weatherStationId) throw new Error(`${SITE} has no weather station; run seedBudgets first`);
    const weather: { date: string | Date; eto: number | null; rain: number | null }[] = await db.query(
      `SELECT date, eto_mm AS eto, rain_mm AS rain FROM daily_weather WHERE station_id = ? AND date
        BETWEEN ? AND ? ORDER BY date`,
      [site.weatherStationId, FROM, TO],
    );
    const byDate = new Map(weather.map((w) => [dateOnly(w.date), w]));
    await db.transaction(async (em) => {
      await em.getRepository(MeterEntity).upsert(
        {
          siteId: site.id,
          ref: METER_REF,
          unit: 'gal',
          registerMultiplier: 1,
          registerDigits: null,
          purpose: 'dedicated-irrigation',
          waterSource: 'recycled',
          installedAt: new Date('2019-03-01T08:00:00Z'),
          removedAt: null,
        },
        ['siteId', 'ref'],
      );
      const meter = await em.getRepository(MeterEntity).findOneByOrFail({ siteId: site.id, ref: METER_REF });
      const rows: unknown[][] = [];
      const random = mulberry32(20260414);
      let lastEto = 3;
      for (let day = FROM; day <= TO; day = nextDate(day)) {
        const w = byDate.get(day);
        // The invented feed has deliberate gaps; the controller still ran, so carry the last day's ETo.
        const eto = w?.eto ?? lastEto;
        lastEto = eto;
        const rain = w?.rain ?? 0;
        const perMm = day < INSTALLED_ON ? SPRAY_GAL_PER_MM : DRIP_GAL_PER_MM;
        // A rain sensor skips watering after a real rain; otherwise use follows ETo with ±15 % day-to-day scatter.
        const watered = rain >= 5 ? 0 : perMm * eto * (0.85 + 0.3 * random());
        const gallons = Number((BASE_GAL_PER_DAY * (0.8 + 0.4 * random()) + watered).toFixed(2));
        const start = localMidnightUtc(day, site.timeZone);
        const minutes = (localMidnightUtc(nextDate(day), site.timeZone) - start) / 60_000;
        rows.push([meter.id, new Date(start), minutes, gallons, gallons, 'gal']);
      }
      const upload = await em.query(
        `INSERT INTO upload (site_id, uploaded_by, kind, file_name, size_bytes, status, rows_read,
          accepted, finished_at) VALUES (?, ?, 'interval-long', ?, 0, 'done', ?, ?, ?)`,
        [site.id, author?.id ?? null, FILE_NAME, rows.length, rows.length, new Date()],
      );
      const uploadId = Number(upload.insertId);
      for (let i = 0; i < rows.length; i += 500) {
        await em.query(
          `INSERT INTO meter_reading (meter_id, start_utc, minutes, volume_gal, original_value,
            original_unit, upload_id) VALUES ?`,
          [rows.slice(i, i + 500).map((r) => [...r, uploadId])],
        );
      }
      await new DailyUseRepository(db).rebuildSite(em, site.id);
      readings = rows.length;
    });
  }
  const title = 'Greenbelt path: spray to drip';
  let projects = 0;
  if (!(await db.getRepository(SavingsProjectEntity).findOneBy({ siteId: site.id, title }))) {
    await db.getRepository(SavingsProjectEntity).insert({
      siteId: site.id,
      title,
      changeKind: 'spray-to-drip',
      changeDescription:
        'Spray heads along the greenbelt path replaced by inline drip under mulch; slope groundcover unchanged.',
      installedOn: INSTALLED_ON,
      baselineFrom: '2025-04',
      baselineTo: '2026-03',
      reportingFrom: '2026-05',
      reportingTo: '2026-11',
      modelForm: 'eto',
      createdBy: author?.id ?? null,
    });
    projects = 1;
  }
  // The demo project is installed (baseline locked) and carries its retrofit list and cost; older demo databases
  // that have the project without them are brought forward once.
  await db.query(
    `UPDATE savings_project SET status = 'installed', locked_at = ?, locked_by = ?, retrofits = ?,
      installed_cost = ?, cost_currency = 'USD' WHERE site_id = ? AND title = ? AND retrofits IS NULL`,
    [new Date(`${INSTALLED_ON}T17:00:00Z`), author?.id ?? null, JSON.stringify(RETROFITS), 18_400, site.id, title],
  );
  return { readings, projects };
}

function nextDate(date: string): string {
  return new Date(Date.parse(`${date}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);
}

/**
 * UTC instant of a local midnight; the offset at UTC midnight matches local midnight for zones that switch at 02:00.
 */
function localMidnightUtc(date: string, zone: string): number {
  const guess = Date.parse(`${date}T00:00:00Z`);
  return guess - zoneOffsetMinutes(guess, zone) * 60_000;
}

function dateOnly(value: string | Date): string {
  return value instanceof Date ? value.toISOString().slice(0, 10) : String(value).slice(0, 10);
}

/** A small seeded generator, so the demo's scatter (and so its fit statistics) is reproducible. */
function mulberry32(seed: number): () => number {
  let a = seed;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
