/**
 * Dashboard API benchmark (`npm run bench:api`): 1,000 sites with a year of hourly readings each (8.76 M rows,
 * LOAD DATA into database `rillmark_bench`, rollups built in SQL), the app in a child process on 127.0.0.1 port 0,
 * autocannon at 20 connections against the portfolio and a site overview. Prints p50/p95/p99 and req/s, and the
 * time of the bare SQL aggregate behind the portfolio as a floor. Not a test: figures vary run to run.
 * The world is generated once and reused while its marker organisation exists (BENCH_REBUILD=1 regenerates).
 */
import { fork, type ChildProcess } from 'node:child_process';
import { createWriteStream, createReadStream, mkdirSync } from 'node:fs';
import { once } from 'node:events';
import { availableParallelism, loadavg } from 'node:os';
import { resolve } from 'node:path';
// @ts-expect-error autocannon ships no types
import autocannon from 'autocannon';
import { createConnection } from 'mysql2/promise';
import { loadConfig } from '../../backend/src/config';
import { connectWithRetry } from '../../backend/src/db/connect';
import { createDataSource } from '../../backend/src/db/data-source';
import { hashPassword } from '../../backend/src/platform/auth/password';
import { setLogLevel } from '../../backend/src/platform/logger';

setLogLevel('warn');
const SITES = Number(process.env['BENCH_SITES'] ?? 1000);
const ORG = 'Bench Portfolio Org (invented)';
const EMAIL = 'bench.manager@bench.example';
const PASSWORD = 'bench-password-for-api-9';
const YEAR_START = Date.UTC(2025, 0, 1, 8); // 2025-01-01 00:00 PST
const HOURS = 365 * 24;
const DURATION = Number(process.env['BENCH_SECONDS'] ?? 10);
const root = resolve(import.meta.dirname, '../..');
const dir = resolve(root, '.data/bench');
mkdirSync(dir, { recursive: true });
const env = {
  ...process.env,
  RILLMARK_DB_NAME: process.env['RILLMARK_BENCH_DB'] ?? 'rillmark_bench',
  RILLMARK_PORT: '0',
  RILLMARK_HOST: '127.0.0.1',
  RILLMARK_LOG_LEVEL: 'warn',
  RILLMARK_DEV_OUTBOX: 'false',
  RILLMARK_JOBS_ENABLED: 'false',
};
const config = loadConfig(env);

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

// 1. The world: one organisation, a manager, SITES sites with one meter each and a year of hourly readings.
let [org] = await db.query('SELECT id FROM organisation WHERE name = ?', [ORG]);
if (!org || process.env['BENCH_REBUILD']) {
  const t0 = performance.now();
  if (org) {
    await db.query(
      `DELETE r FROM meter_reading r JOIN meter m ON m.id = r.meter_id JOIN site s ON s.id =
        m.site_id WHERE s.organisation_id = ?`,
      [org.id],
    );
    await db.query('DELETE d FROM site_daily_use d JOIN site s ON s.id = d.site_id WHERE s.organisation_id = ?', [
      org.id,
    ]);
    await db.query('DELETE u FROM site_monthly_use u JOIN site s ON s.id = u.site_id WHERE s.organisation_id = ?', [
      org.id,
    ]);
    await db.query('DELETE b FROM site_monthly_budget b JOIN site s ON s.id = b.site_id WHERE s.organisation_id = ?', [
      org.id,
    ]);
    await db.query('DELETE m FROM meter m JOIN site s ON s.id = m.site_id WHERE s.organisation_id = ?', [org.id]);
    await db.query('DELETE FROM site WHERE organisation_id = ?', [org.id]);
  } else {
    const res = await db.query(`INSERT INTO organisation (name, kind) VALUES (?, 'property-manager')`, [ORG]);
    org = { id: res.insertId };
    const user = await db.query(
      `INSERT INTO user (email, display_name, status, password_hash) VALUES (?, 'Bench Manager', 'active', ?)`,
      [EMAIL, await hashPassword(PASSWORD)],
    );
    await db.query(`INSERT INTO membership (user_id, organisation_id, role) VALUES (?, ?, 'manager')`, [
      user.insertId,
      org.id,
    ]);
  }
  const siteRows = Array.from({ length: SITES }, (_, i) => [
    org.id,
    `Bench site ${String(i + 1).padStart(4, '0')}`,
    'park',
    `${i + 1} Bench Way, Nowhere`,
    'America/Los_Angeles',
    '',
  ]);
  await db.query('INSERT INTO site (organisation_id, name, kind, address, time_zone, notes) VALUES ?', [siteRows]);
  const sites: { id: number }[] = await db.query('SELECT id FROM site WHERE organisation_id = ? ORDER BY id', [org.id]);
  await db.query(`INSERT INTO meter (site_id, ref, unit, register_multiplier, purpose, water_source) VALUES ?`, [
    sites.map((s) => [s.id, 'BENCH-01', 'gal', 1, 'dedicated-irrigation', 'recycled']),
  ]);
  const meters: { id: number; siteId: number }[] = await db.query(
    `SELECT m.id, m.site_id AS siteId FROM meter m JOIN site s ON s.id = m.site_id WHERE
      s.organisation_id = ? ORDER BY m.id`,
    [org.id],
  );
  const [upload] = await db.query(
    `INSERT INTO upload (site_id, file_name, status) VALUES (?, 'bench.tsv', 'done') RETURNING id`,
    [sites[0]!.id],
  );
  const tsv = resolve(dir, 'api-bench-readings.tsv');
  const out = createWriteStream(tsv);
  for (const [i, m] of meters.entries()) {
    let chunk = '';
    for (let h = 0; h < HOURS; h++) {
      const at = new Date(YEAR_START + h * 3_600_000).toISOString();
      const hour = h % 24;
      // Watering 22:00–01:00 local; a tenth of the sites leak a little all night.
      const gallons = (hour >= 22 || hour < 2 ? 40 + ((h * 7 + i) % 20) : 0) + (i % 10 === 0 ? 3 : 0);
      chunk += `${m.id}\t${at.slice(0, 10)} ${at.slice(11, 19)}\t60\t${gallons}\t${gallons}\tgal\t${upload.id}\n`;
    }
    if (!out.write(chunk)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
  const conn = await createConnection({
    host: config.db.host,
    port: config.db.port,
    user: config.db.user,
    password: config.db.password,
    database: config.db.database,
  });
  await conn.query({
    sql:
      "LOAD DATA LOCAL INFILE 'readings.tsv' INTO TABLE meter_reading " +
      "FIELDS TERMINATED BY '\\t' LINES TERMINATED BY '\\n' (meter_id, " +
      'start_utc, minutes, volume_gal, original_value, original_unit, upload_id)',
    infileStreamFactory: () => createReadStream(tsv),
  });
  await conn.end();
  // The daily rollup for all bench sites in one statement (the same grouping DailyUseRepository.refresh uses).
  await db.query(
    `INSERT INTO site_daily_use (site_id, local_date, gallons, covered_minutes, reading_count)
     SELECT m.site_id, DATE(CONVERT_TZ(r.start_utc, '+00:00', s.time_zone)) AS d,
      SUM(r.volume_gal), SUM(r.minutes), COUNT(*)
     FROM meter_reading r JOIN meter m ON m.id = r.meter_id JOIN site s ON s.id = m.site_id
     WHERE s.organisation_id = ? GROUP BY m.site_id, d`,
    [org.id],
  );
  await db.query(
    `INSERT INTO site_monthly_use (site_id, month, gallons, covered_minutes, days)
     SELECT d.site_id, DATE_FORMAT(d.local_date, '%Y-%m') AS m, SUM(d.gallons), SUM(d.covered_minutes), COUNT(*)
     FROM site_daily_use d JOIN site s ON s.id = d.site_id WHERE s.organisation_id = ? GROUP BY d.site_id, m`,
    [org.id],
  );
  console.log(
    `generated ${SITES} sites × ${HOURS} hourly readings = ${(SITES * HOURS).toLocaleString('en-US')} ` +
      `rows in ${((performance.now() - t0) / 1000).toFixed(0)} s`,
  );
}
// Budgets: the cache the portfolio reads, refreshed every run so it counts as fresh (synthetic, 24,000–36,000 gal a
// month;
// 5,000 for a tenth of the sites).
const siteIds: number[] = (await db.query('SELECT id FROM site WHERE organisation_id = ? ORDER BY id', [org.id])).map(
  (s: { id: number }) => Number(s.id),
);
const months = Array.from({ length: 24 }, (_, i) => new Date(Date.UTC(2024, i, 1)).toISOString().slice(0, 7));
for (let i = 0; i < siteIds.length; i += 200) {
  // Every tenth site gets a budget below its use, so the portfolio also prices the gap (money over budget).
  const rows = siteIds
    .slice(i, i + 200)
    .flatMap((id, k) =>
      months.map((m) => [
        id,
        m,
        (i + k) % 10 === 3 ? 5_000 : 24_000 + ((i + k) % 50) * 250,
        null,
        null,
        150,
        10,
        0,
        null,
        new Date(),
      ]),
    );
  await db.query(
    `REPLACE INTO site_monthly_budget (site_id, month, gallons, cost, currency, eto_mm, rain_mm,
      filled_days, problem, computed_at) VALUES ?`,
    [rows],
  );
}

// 2. The bare SQL floor: the same aggregate the portfolio needs, without the app.
const floorSql = `SELECT s.id, COALESCE(u.gal, 0) AS gal, b.gal AS budget FROM site s
  LEFT JOIN (SELECT site_id, SUM(gallons) AS gal FROM site_daily_use WHERE local_date BETWEEN
  '2025-06-01' AND '2025-06-30' GROUP BY site_id) u ON u.site_id = s.id
  LEFT JOIN (SELECT site_id, SUM(gallons) AS gal FROM site_monthly_budget WHERE month = '2025-06'
  GROUP BY site_id) b ON b.site_id = s.id
  WHERE s.organisation_id = ? ORDER BY u.gal / b.gal DESC LIMIT 25`;
const floor: number[] = [];
for (let i = 0; i < 30; i++) {
  const t = performance.now();
  await db.query(floorSql, [org.id]);
  floor.push(performance.now() - t);
}
floor.sort((a, b) => a - b);
await db.destroy();

// 3. The app in its own process (as deployed: autocannon must not share its event loop), a signed-in session.
const child: ChildProcess = fork(resolve(import.meta.dirname, 'bench-server.ts'), [], {
  env: { ...env, TSX_TSCONFIG_PATH: resolve(root, 'backend/tsconfig.json') },
  execArgv: ['--import', 'tsx', ...(process.env['BENCH_CPU_PROF'] ? ['--cpu-prof', `--cpu-prof-dir=${dir}`] : [])],
});
const [{ url }] = (await once(child, 'message')) as [{ url: string }];
const server = { url };
/** The server process's CPU time so far: per request it is the cost that doesn't depend on how busy the machine is. */
const serverCpuMs = async (): Promise<number> => {
  const reply = once(child, 'message') as Promise<[{ cpuMs: number }]>;
  child.send({ cmd: 'cpu' });
  return (await reply)[0].cpuMs;
};
const csrf = await fetch(`${server.url}/api/auth/csrf`);
let cookies = csrf.headers.getSetCookie().map((c) => c.split(';')[0]!);
const token = ((await csrf.json()) as { token: string }).token;
const signIn = await fetch(`${server.url}/api/auth/sign-in`, {
  method: 'POST',
  headers: { 'content-type': 'application/json', 'x-xsrf-token': token, cookie: cookies.join('; ') },
  body: JSON.stringify({ email: EMAIL, password: PASSWORD }),
});
if (signIn.status !== 200) throw new Error(`sign-in failed: ${signIn.status} ${await signIn.text()}`);
const fresh = signIn.headers.getSetCookie().map((c) => c.split(';')[0]!);
cookies = [...cookies.filter((c) => !fresh.some((f) => f.split('=')[0] === c.split('=')[0])), ...fresh];
const headers = { cookie: cookies.join('; ') };

const targets = [
  {
    name: 'portfolio (month, 1,000 sites, sorted by % of budget)',
    path: '/api/portfolio?period=month&from=2025-06-01&sort=percentOfBudget&dir=desc',
  },
  { name: 'site overview (30 days)', path: `/api/sites/${siteIds[500]}/overview?from=2025-06-01&to=2025-06-30` },
  { name: 'site hourly grid (1 month)', path: `/api/sites/${siteIds[500]}/hourly-grid?month=2025-06` },
  { name: 'site monthly table (12 months)', path: `/api/sites/${siteIds[500]}/monthly?from=2024-07&to=2025-06` },
  // Not the dashboard's: the existing sites list, as this machine's ceiling for any signed-in request.
  { name: 'reference: sites list (25 rows)', path: '/api/sites?pageSize=25' },
];
const loadBefore = loadavg()
  .map((l) => l.toFixed(1))
  .join(' ');
const results: string[] = [];
// BENCH_ONLY=<word> runs only the targets whose name contains it (for profiling one endpoint).
for (const target of targets.filter((t) => t.name.includes(process.env['BENCH_ONLY'] ?? ''))) {
  const check = await fetch(server.url + target.path, { headers });
  if (check.status !== 200) throw new Error(`${target.path}: ${check.status} ${await check.text()}`);
  const cpu0 = await serverCpuMs();
  const r = await autocannon({ url: server.url + target.path, connections: 20, duration: DURATION, headers });
  const cpuPerRequest = ((await serverCpuMs()) - cpu0) / r.requests.total;
  results.push(
    `${target.name.padEnd(56)} p50 ${r.latency.p50} ms  p95 ${percentile(r, 95)} ` +
      `ms  p99 ${r.latency.p99} ms  ${Math.round(r.requests.average)} ` +
      `req/s  (${r.non2xx} non-2xx)  server CPU ${cpuPerRequest.toFixed(1)} ms/request`,
  );
}
// Uncached: the portfolio memoises one scope's sums for 20 s, so also time requests that each miss it
// (a different custom range every time), one at a time.
const cold: number[] = [];
for (let i = 0; i < 15; i++) {
  const t = performance.now();
  const res = await fetch(
    `${server.url}/api/portfolio?period=custom&from=2025-05-01&to=2025-06-${String(10 + i).padStart(2, '0')}` +
      '&sort=percentOfBudget&dir=desc',
    { headers },
  );
  await res.arrayBuffer();
  cold.push(performance.now() - t);
}
cold.sort((a, b) => a - b);
results.push(
  `${'portfolio, memo missed every time (1 connection, 15 runs)'.padEnd(56)} ` +
    `p50 ${cold[7]!.toFixed(0)} ms  max ${cold[14]!.toFixed(0)} ms`,
);
child.send({ cmd: 'stop' });
await once(child, 'exit');
const floorP50 = floor[Math.floor(floor.length / 2)]!;
console.log(
  `\n20 connections, ${DURATION} s each, ${SITES} sites, database ${config.db.database}; ` +
    `load average before ${loadBefore}, after ${loadavg()
      .map((l) => l.toFixed(1))
      .join(' ')} (${availableParallelism()} cores)`,
);
for (const line of results) console.log(line);
console.log(
  `bare SQL portfolio aggregate: p50 ${floorP50.toFixed(1)} ms ` +
    '(single connection, 30 runs) — the floor for the portfolio endpoint',
);

/** autocannon reports p90/p97.5/p99; p95 is interpolated between p90 and p97.5. */
function percentile(r: { latency: Record<string, number> }, p: 95): number {
  const lo = r.latency['p90']!,
    hi = r.latency['p97_5']!;
  return Math.round((lo + ((hi - lo) * (p - 90)) / 7.5) * 10) / 10;
}
