import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { Readable } from 'node:stream';
import type { DataSource } from 'typeorm';
import { AuditRepository } from '../../backend/src/components/audit/data/audit-repository';
import { AuthService } from '../../backend/src/components/auth/domain/auth-service';
import { ControllerEntity } from '../../backend/src/components/meters/data/controller.entity';
import { MeterRegisterPeriodEntity } from '../../backend/src/components/meters/data/meter-register-period.entity';
import { MeterEntity } from '../../backend/src/components/meters/data/meter.entity';
import { createMeters } from '../../backend/src/components/meters/meters-module';
import { ZoneEntity } from '../../backend/src/components/meters/data/zone.entity';
import { DailyUseRepository } from '../../backend/src/components/readings/data/daily-use-repository';
import { OrganisationEntity } from '../../backend/src/components/organisations/data/organisation.entity';
import { SiteEntity } from '../../backend/src/components/sites/data/site.entity';
import { createSites } from '../../backend/src/components/sites/sites-module';
import { createOrganisations } from '../../backend/src/components/organisations/organisations-module';
import { createWeather } from '../../backend/src/components/weather/weather-module';
import { createUploads } from '../../backend/src/components/uploads/uploads-module';
import { UsersRepository } from '../../backend/src/components/users/data/users-repository';
import { UserEntity } from '../../backend/src/components/users/data/user.entity';
import type { Config } from '../../backend/src/config';
import type { WaterSource } from '@shared/meters/meter';
import type { VolumeUnit } from '@shared/units/volume-units';
import { DEMO_ORGANISATIONS, DEMO_USERS } from './demo-scenario';
import { meterCsv, runtimeCsv, type DemoFlow, type DemoProgram } from './demo-readings';

interface CatalogueMeter {
  ref: string;
  unit: VolumeUnit;
  registerDigits?: number;
  multiplier?: number;
  registers?: Array<{ installedUtc: string; removedUtc: string | null; multiplier: number; digits: number }>;
}
const catalogue = JSON.parse(readFileSync(resolve(import.meta.dirname, '../../samples/catalogue.json'), 'utf8')) as {
  sites: Array<{ name: string; meters: CatalogueMeter[]; controllers: string[] }>;
};

/** Which demo site holds which sample meters and controllers, and how its invented water use looks. */
/**
 * Each site's meters water exactly while its controller runs (stations back to back over the window, at about
 * the zones' design flow), so the nightly watch finds only the invented events: a stuck valve at North Commons,
 * a zone left running at Tannery Point, a stopped meter at North Commons, and the leak at Juniper Hollow.
 */
const PLACEMENTS: Array<{
  demoSite: string;
  waterSource: WaterSource;
  stations: string[];
  gpm: number;
  program: DemoProgram;
  flows: DemoFlow[];
}> = [
  {
    demoSite: 'Willowmere HOA — North Commons',
    waterSource: 'recycled',
    stations: ['1', '2', '3', '4'],
    gpm: 9.5,
    program: { startHour: 22, minutesPerStation: 60 },
    flows: [
      {
        meterRef: 'HOA-NORTH-01',
        wateringGph: 330,
        baseGph: 3,
        window: [22, 23, 0, 1],
        broken: { from: '2026-11-26', to: '2026-11-28' },
      },
      // A valve that stuck open as the program ended, one night in November, at about a station's design flow.
      {
        meterRef: 'HOA-NORTH-02',
        wateringGph: 240,
        baseGph: 2,
        window: [22, 23, 0, 1],
        extra: [{ date: '2026-11-21', hours: [2, 3, 4, 5], gph: 560 }],
        broken: { from: '2026-11-26', to: '2026-11-28' },
      },
    ],
  },
  {
    demoSite: 'Tannery Point Office Park',
    waterSource: 'recycled',
    stations: ['1', '2', '3', '4'],
    gpm: 6,
    // Station 4 ran 165 minutes instead of 45 one morning (a controller fault).
    program: { startHour: 3, minutesPerStation: 45, longRun: { date: '2026-11-17', station: '4', minutes: 165 } },
    flows: [
      {
        meterRef: 'OFFICE-PARK-01',
        wateringGph: 220,
        baseGph: 4,
        window: [3, 4, 5],
        extra: [{ date: '2026-11-17', hours: [6, 7], gph: 220 }],
      },
      {
        meterRef: 'OFFICE-PARK-02',
        wateringGph: 140,
        baseGph: 1,
        window: [3, 4, 5],
        extra: [{ date: '2026-11-17', hours: [6, 7], gph: 140 }],
      },
    ],
  },
  {
    demoSite: 'Juniper Hollow Elementary Fields',
    waterSource: 'recycled',
    stations: ['A1', 'A2', 'A3', 'B1'],
    gpm: 12,
    program: { startHour: 21, minutesPerStation: 60 },
    flows: [
      // The leak the dashboards should find: water running all day and night for five days in November.
      {
        meterRef: 'SCHOOL-01',
        wateringGph: 480,
        baseGph: 2,
        window: [21, 22, 23, 0],
        leak: { from: '2026-11-10', to: '2026-11-14', gph: 38 },
      },
      { meterRef: 'SCHOOL-02', wateringGph: 240, baseGph: 2, window: [21, 22, 23, 0] },
    ],
  },
];

/**
 * Puts the sample meters and controllers on three demo sites, then brings in ~3 months of invented hourly readings
 * and runtime logs through the upload code path (the same function the API calls). Idempotent: equipment is
 * matched by ref; the generated files are identical each run, so their second import is "already imported".
 */
export async function seedMeters(
  db: DataSource,
  config: Config,
): Promise<{ meters: number; uploads: number; readings: number }> {
  const org = await db
    .getRepository(OrganisationEntity)
    .findOneByOrFail({ name: DEMO_ORGANISATIONS.find((o) => o.key === 'cobalt')!.name });
  const adminEmail = DEMO_USERS.find((u) => u.organisation === 'cobalt' && u.role === 'admin')!.email;
  const adminUser = await db.getRepository(UserEntity).findOneByOrFail({ email: adminEmail });
  let meters = 0;
  const work: Array<{ siteId: number; name: string; csv: string }> = [];

  for (const p of PLACEMENTS) {
    const site = await db.getRepository(SiteEntity).findOneByOrFail({ organisationId: org.id, name: p.demoSite });
    const sample = catalogue.sites.find((s) => s.name === p.demoSite)!;
    for (const m of sample.meters) {
      const registers = m.registers ?? [];
      const current = registers.at(-1);
      await db.getRepository(MeterEntity).upsert(
        {
          siteId: site.id,
          ref: m.ref,
          unit: m.unit,
          registerMultiplier: current?.multiplier ?? m.multiplier ?? 1,
          registerDigits: current?.digits ?? m.registerDigits ?? null,
          purpose: 'dedicated-irrigation',
          waterSource: p.waterSource,
          installedAt: new Date(current?.installedUtc ?? '2019-05-01T00:00:00.000Z'),
          removedAt: null,
        },
        ['siteId', 'ref'],
      );
      const meter = await db.getRepository(MeterEntity).findOneByOrFail({ siteId: site.id, ref: m.ref });
      await db.getRepository(MeterRegisterPeriodEntity).delete({ meterId: meter.id });
      for (const r of registers.slice(0, -1)) {
        await db.getRepository(MeterRegisterPeriodEntity).insert({
          meterId: meter.id,
          installedAt: new Date(r.installedUtc),
          removedAt: new Date(r.removedUtc!),
          multiplier: r.multiplier,
          digits: r.digits,
        });
      }
      meters++;
    }
    for (const ref of sample.controllers) {
      await db
        .getRepository(ControllerEntity)
        .upsert({ siteId: site.id, ref, name: `${p.demoSite.split(' ')[0]} controller A` }, ['siteId', 'ref']);
      const controller = await db.getRepository(ControllerEntity).findOneByOrFail({ siteId: site.id, ref });
      await db.getRepository(ZoneEntity).upsert(
        p.stations.map((station, i) => ({
          controllerId: controller.id,
          station,
          name: `Station ${station}`,
          hydrozoneId: null,
          designGpm: p.gpm,
          emitterCount: i % 2 ? 180 : null,
          emitterGph: i % 2 ? 1 : null,
        })),
        ['controllerId', 'station'],
      );
      work.push({
        siteId: site.id,
        name: `${ref.toLowerCase()}-runtime-2026-09-to-11.csv`,
        csv: runtimeCsv(ref, p.stations, p.program, p.gpm),
      });
    }
    work.unshift({
      siteId: site.id,
      name: `${p.demoSite.split(' ')[0]!.toLowerCase()}-hourly-2026-09-to-11.csv`,
      csv: meterCsv(p.flows),
    });
  }

  // The real import path, acting as the organisation's administrator.
  const audit = new AuditRepository(db);
  const auth = new AuthService(db, new UsersRepository(db), audit);
  const sites = createSites({ db, audit }).service;
  const metersService = createMeters({ db, sites, audit }).service;
  const dailyUse = new DailyUseRepository(db);
  const organisations = createOrganisations({ db, audit }).settings;
  const weather = createWeather({ db, config, sites, audit });
  const importer = createUploads({
    db,
    config,
    sites,
    meters: metersService,
    organisations,
    dailyWeather: weather.daily,
    dailyUse,
    audit,
  }).service;
  const principal = (await auth.principal(adminUser.id, org.id))!;
  let uploads = 0;
  let readings = 0;
  for (const w of work) {
    const result = await importer.ingest(
      principal,
      { siteId: w.siteId },
      {
        fileName: w.name,
        file: Readable.from([Buffer.from(w.csv)]),
        replaceConflicts: false,
        rowErrors: 'keep-valid',
        repeats: 'not-stored',
      },
    );
    if (result.outcome === 'imported') {
      uploads++;
      readings += result.upload.accepted;
      if (result.upload.rejected) throw new Error(`demo file ${w.name}: ${result.upload.rejected} rows rejected`);
    }
  }
  return { meters, uploads, readings };
}
