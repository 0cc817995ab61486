/**
 * Nightly-watch benchmark (`npm run bench:nightly`): BENCH_SITES (default 1,000) sites with a year of hourly meter
 * data and controller runtime logs in database `rillmark_bench_watch` (generated once with LOAD DATA, reused), then
 * times (1) one night's incremental run — every site has one new day since the last check — and (2) a full-year
 * backfill (a re-check of the whole year), each against a bare SQL scan of the same rows as the floor, with the
 * process's peak RSS. Not a test: figures vary ±25 % run to run (shared/STACK.md).
 */
import { createReadStream, createWriteStream, mkdirSync } from 'node:fs';
import { once } from 'node:events';
import { resolve } from 'node:path';
import { createConnection, type Connection } from 'mysql2/promise';
import { createApp } from '../../backend/src/app';
import { loadConfig } from '../../backend/src/config';
import { connectWithRetry } from '../../backend/src/db/connect';
import { createDataSource } from '../../backend/src/db/data-source';
import { setLogLevel } from '../../backend/src/platform/logger';

setLogLevel('warn');
const SITES = Number(process.env['BENCH_SITES'] ?? 1000);
const DAYS = 365;
const HOUR = 3_600_000;
/** Fixed "now", so generated data and runs line up from one run to the next. */
const END = Date.UTC(2026, 10, 30, 12);
const START = END - DAYS * 24 * HOUR;
const ZONES = 4;
const ORG = 'Bench Watch Organisation';
const dir = resolve(import.meta.dirname, '../../.data/bench');
mkdirSync(dir, { recursive: true });
const config = loadConfig({
  ...process.env,
  RILLMARK_DB_NAME: process.env['RILLMARK_BENCH_DB'] ?? 'rillmark_bench_watch',
  RILLMARK_LOG_LEVEL: 'warn',
  RILLMARK_DEV_OUTBOX: 'false',
});

const admin = await createConnection({
  host: config.db.host,
  port: config.db.port,
  user: config.db.user,
  password: config.db.password,
});
await admin.query(
  `CREATE DATABASE IF NOT EXISTS \`${config.db.database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
);
await admin.end();
const db = createDataSource(config.db);
await connectWithRetry(db, { attempts: 5 });
await db.runMigrations({ transaction: 'each' });
const conn = await createConnection({
  host: config.db.host,
  port: config.db.port,
  user: config.db.user,
  password: config.db.password,
  database: config.db.database,
});

const siteIds = await ensureData(conn);
const readingRows = Number(((await db.query('SELECT COUNT(*) AS n FROM meter_reading')) as [{ n: string }])[0].n);
console.log(
  `data: ${SITES} sites, ${readingRows.toLocaleString('en-US')} hourly readings (${DAYS} days), ${ZONES} zones each`,
);

const noMail = { send: async () => undefined, close: () => undefined };
const { watch, close } = createApp({ config, db, mailer: noMail });
const orgId = Number(((await db.query('SELECT id FROM organisation WHERE name = ?', [ORG])) as [{ id: number }])[0].id);

// 1. One night: every site was checked yesterday at this time and has one new day of data since.
await resetWatch(siteIds);
await db.query(
  `INSERT INTO watch_site_state (site_id, last_data_utc, last_checked_as_of_utc) SELECT id, ?, ?
    FROM site WHERE organisation_id = ?`,
  [new Date(END - 25 * HOUR), new Date(END - 24 * HOUR), orgId],
);
const night = await timed(() =>
  watch.service.run({ trigger: 'manual', organisationId: orgId, requestedBy: null, toUtc: new Date(END) }),
);
const nightFloor = await timed(() =>
  conn.query(
    `SELECT m.site_id, COUNT(*), SUM(r.volume_gal) FROM meter_reading r JOIN meter m ON m.id =
      r.meter_id WHERE m.site_id IN (?) AND r.start_utc >= ? GROUP BY m.site_id`,
    [siteIds, new Date(END - 25 * HOUR - 45 * 24 * HOUR)],
  ),
);
report('one night (incremental)', night, nightFloor);

// 2. Full-year backfill: a re-check of every site over the whole year.
await resetWatch(siteIds);
const backfill = await timed(() =>
  watch.service.run({
    trigger: 'recheck',
    organisationId: orgId,
    requestedBy: null,
    fromUtc: new Date(START),
    toUtc: new Date(END),
  }),
);
const backfillFloor = await timed(() =>
  conn.query(
    `SELECT m.site_id, COUNT(*), SUM(r.volume_gal) FROM meter_reading r JOIN meter m ON m.id =
      r.meter_id WHERE m.site_id IN (?) GROUP BY m.site_id`,
    [siteIds],
  ),
);
report('full-year backfill', backfill, backfillFloor);
console.log('targets: one night < 30 s, backfill < 600 s (2-core machine)');

await close();
await conn.end();
await db.destroy();

type Run = Awaited<ReturnType<typeof watch.service.run>>;

function report(
  label: string,
  run: { seconds: number; peakRssMb: number; value: Run },
  floor: { seconds: number },
): void {
  const r = run.value!;
  console.log(
    `${label}: ${run.seconds.toFixed(1)} s for ${r.sitesChecked} ` +
      `sites (${r.sitesSkipped} skipped, ${r.errors.length} errors), ` +
      `${r.findings} findings, ${r.alertsRaised} alerts raised; peak RSS ${run.peakRssMb.toFixed(0)} MB; ` +
      `bare SQL scan of the same rows ${floor.seconds.toFixed(1)} s; ` +
      `ratio ${(run.seconds / floor.seconds).toFixed(1)}×`,
  );
}

async function timed<T>(work: () => Promise<T>): Promise<{ seconds: number; peakRssMb: number; value: T }> {
  let peak = process.memoryUsage().rss;
  const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 50);
  const t0 = performance.now();
  const value = await work();
  const seconds = (performance.now() - t0) / 1000;
  clearInterval(sampler);
  return { seconds, peakRssMb: Math.max(peak, process.memoryUsage().rss) / 1048576, value };
}

async function resetWatch(ids: number[]): Promise<void> {
  await db.query('DELETE FROM alert WHERE site_id IN (?)', [ids]);
  await db.query('DELETE FROM watch_site_state WHERE site_id IN (?)', [ids]);
}

/**
 * Sites, meters, controllers and zones, then a year of hourly readings and runtime logs through LOAD DATA. Every
 * site waters four zones on alternate nights; one in twenty leaks for a week, one in twenty has a zone running long.
 */
async function ensureData(c: Connection): Promise<number[]> {
  const [[existing]] = (await c.query(
    'SELECT COUNT(*) AS n FROM site s JOIN organisation o ON o.id = s.organisation_id WHERE o.name = ?',
    [ORG],
  )) as unknown as [[{ n: number }]];
  if (Number(existing!.n) === SITES) {
    return (
      (await c.query(
        'SELECT s.id FROM site s JOIN organisation o ON o.id = s.organisation_id WHERE o.name = ? ORDER BY s.id',
        [ORG],
      )) as unknown as [{ id: number }[]]
    )[0].map((r) => r.id);
  }
  console.log(`generating ${SITES} sites × ${DAYS} days of hourly data (once)…`);
  await c.query('SET FOREIGN_KEY_CHECKS = 0');
  for (const t of [
    'alert_event',
    'alert',
    'watch_site_state',
    'site_watch_settings',
    'runtime_event',
    'zone',
    'controller',
    'meter_reading',
    'meter',
    'site',
  ])
    await c.query(`DELETE FROM \`${t}\``);
  await c.query('SET FOREIGN_KEY_CHECKS = 1');
  await c.query('INSERT IGNORE INTO organisation (name, kind) VALUES (?, ?)', [ORG, 'property-manager']);
  const [[org]] = (await c.query('SELECT id FROM organisation WHERE name = ?', [ORG])) as unknown as [[{ id: number }]];
  const sites = Array.from({ length: SITES }, (_, i) => [
    org!.id,
    `Bench grounds ${String(i + 1).padStart(4, '0')}`,
    'park',
    `${i + 1} Bench Row`,
    'America/Phoenix',
    '',
  ]);
  await c.query('INSERT INTO site (organisation_id, name, kind, address, time_zone, notes) VALUES ?', [sites]);
  const [siteRows] = (await c.query('SELECT id FROM site WHERE organisation_id = ? ORDER BY id', [
    org!.id,
  ])) as unknown as [{ id: number }[]];
  const ids = siteRows.map((r) => r.id);
  await c.query(
    `INSERT INTO meter (site_id, ref, unit, purpose, water_source) SELECT id, 'M1', 'gal',
      'dedicated-irrigation', 'potable' FROM site WHERE organisation_id = ?`,
    [org!.id],
  );
  await c.query(
    "INSERT INTO controller (site_id, ref, name) SELECT id, 'C1', 'Controller' FROM site WHERE organisation_id = ?",
    [org!.id],
  );
  for (let z = 1; z <= ZONES; z++) {
    await c.query(
      `INSERT INTO zone (controller_id, station, name, design_gpm) SELECT c.id, ?, ?, 8 FROM
        controller c JOIN site s ON s.id = c.site_id WHERE s.organisation_id = ?`,
      [String(z), `Station ${z}`, org!.id],
    );
  }
  const [meters] = (await c.query('SELECT m.id, m.site_id FROM meter m WHERE m.site_id IN (?)', [ids])) as unknown as [
    { id: number; site_id: number }[],
  ];
  const [zones] = (await c.query(
    `SELECT z.id, c.site_id, z.station FROM zone z JOIN controller c ON c.id = z.controller_id
      WHERE c.site_id IN (?) ORDER BY z.id`,
    [ids],
  )) as unknown as [{ id: number; site_id: number; station: string }[]];
  const meterOf = new Map(meters.map((m) => [m.site_id, m.id]));
  const zonesOf = new Map<number, number[]>();
  for (const z of zones) zonesOf.set(z.site_id, [...(zonesOf.get(z.site_id) ?? []), z.id]);

  const readings = resolve(dir, 'watch-readings.tsv');
  const runs = resolve(dir, 'watch-runs.tsv');
  const rOut = createWriteStream(readings);
  const eOut = createWriteStream(runs);
  const iso = (ms: number) => new Date(ms).toISOString().slice(0, 19).replace('T', ' ');
  for (let s = 0; s < ids.length; s++) {
    const siteId = ids[s]!;
    const leakDay = s % 20 === 0 ? 200 + (s % 100) : -1;
    const longZoneDay = s % 20 === 10 ? 150 + (s % 90) : -1;
    let rChunk = '';
    let eChunk = '';
    for (let d = 0; d < DAYS; d++) {
      const dayStart = START + d * 24 * HOUR;
      // Phoenix is UTC−7: watering 21:00–22:59 local is 04:00–05:59 UTC; every other night.
      const waters = d % 2 === 0;
      for (let h = 0; h < 24; h++) {
        let gal = 0;
        if (waters && (h === 4 || h === 5)) gal = ((ZONES * 8 * 30) / 2) * (d === longZoneDay && h === 5 ? 2 : 1);
        if (leakDay >= 0 && d >= leakDay && d < leakDay + 7) gal += 25;
        const volume = gal.toFixed(4);
        rChunk += `${meterOf.get(siteId)}\t${iso(dayStart + h * HOUR)}\t60\t${volume}\t${volume}\tgal\t0\n`;
      }
      if (waters) {
        zonesOf.get(siteId)!.forEach((zoneId, i) => {
          const minutes = d === longZoneDay && i === ZONES - 1 ? 60 : 30;
          eChunk += `${zoneId}\t${iso(dayStart + 4 * HOUR + i * 30 * 60_000)}\t${minutes}\tscheduled\t0\n`;
        });
      }
    }
    if (!rOut.write(rChunk)) await once(rOut, 'drain');
    if (!eOut.write(eChunk)) await once(eOut, 'drain');
  }
  rOut.end();
  eOut.end();
  await Promise.all([once(rOut, 'finish'), once(eOut, 'finish')]);
  const t0 = performance.now();
  await c.query({
    sql:
      "LOAD DATA LOCAL INFILE 'r.tsv' INTO TABLE meter_reading FIELDS " +
      "TERMINATED BY '\\t' LINES TERMINATED BY '\\n' (meter_id, start_utc, " +
      'minutes, volume_gal, original_value, original_unit, upload_id)',
    infileStreamFactory: () => createReadStream(readings),
  });
  await c.query({
    sql:
      "LOAD DATA LOCAL INFILE 'e.tsv' INTO TABLE runtime_event FIELDS " +
      "TERMINATED BY '\\t' LINES TERMINATED BY '\\n' (zone_id, start_utc, " +
      'minutes, cause, upload_id)',
    infileStreamFactory: () => createReadStream(runs),
  });
  console.log(`loaded in ${((performance.now() - t0) / 1000).toFixed(0)} s`);
  return ids;
}
