/**
 * Ingest benchmark (`npm run bench:ingest`): ≥ 1,000,000 interval readings as CSV, uploaded through the real HTTP
 * API to a server in a child process (database `rillmark_bench`), then the same rows loaded with raw
 * `LOAD DATA LOCAL INFILE` into a scratch copy of `meter_reading` in the same run (and, for comparison, into a
 * bare primary-key-only table). Prints rows/s, the ratios, the load average and the server's peak RSS growth
 * during the upload. Not a test: figures vary ±25 % run to run (see shared/STACK.md).
 */
import { fork, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { createReadStream, createWriteStream, mkdirSync, statSync } from 'node:fs';
import { request } from 'node:http';
import { availableParallelism, loadavg } from 'node:os';
import { resolve } from 'node:path';
import { createConnection } from 'mysql2/promise';
import { loadConfig } from '../../backend/src/config';
import { connectWithRetry } from '../../backend/src/db/connect';
import { createDataSource } from '../../backend/src/db/data-source';
import { setLogLevel } from '../../backend/src/platform/logger';
import { seedBenchWorld } from './bench-world';

setLogLevel('warn');
const ROWS = Number(process.env['BENCH_ROWS'] ?? 1_000_000);
const METERS = 100;
const root = resolve(import.meta.dirname, '../..');
const dir = resolve(root, '.data/bench');
mkdirSync(dir, { recursive: true });
const env = {
  ...process.env,
  RILLMARK_DB_NAME: process.env['RILLMARK_BENCH_DB'] ?? 'rillmark_bench',
  RILLMARK_PORT: '0',
  RILLMARK_LOG_LEVEL: process.env['BENCH_LOG'] ?? 'warn',
  RILLMARK_UPLOAD_MAX_MB: '2000',
  RILLMARK_UPLOAD_DIR: resolve(dir, 'uploads'),
  RILLMARK_DEV_OUTBOX: 'false',
};
const config = loadConfig(env);

// 1. Database, schema and a site with METERS meters.
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
const world = await seedBenchWorld(db, METERS);

// 2. The CSV (local wall times, as utilities export them) and the same rows pre-converted for the raw load.
const csvPath = resolve(dir, 'readings.csv');
const rawPath = resolve(dir, 'readings.tsv');
{
  const csv = createWriteStream(csvPath);
  const raw = createWriteStream(rawPath);
  csv.write('Meter #,Interval Start,Usage (Gal)\n');
  const perMeter = Math.ceil(ROWS / METERS);
  // Winter hours in Phoenix (no DST), so wall time + 7 h is UTC and both files hold exactly the same instants.
  const start = Date.UTC(2025, 0, 1);
  let csvChunk = '';
  let rawChunk = '';
  for (let m = 0; m < METERS && m * perMeter < ROWS; m++) {
    const ref = world.meterRefs[m]!;
    for (let h = 0; h < perMeter && m * perMeter + h < ROWS; h++) {
      const wall = new Date(start + h * 3_600_000).toISOString();
      const gallons = ((h * 37 + m * 11) % 400) / 4;
      csvChunk += `${ref},${wall.slice(0, 10)} ${wall.slice(11, 16)},${gallons.toFixed(2)}\n`;
      const utc = new Date(start + h * 3_600_000 + 7 * 3_600_000).toISOString();
      rawChunk += `${world.meterIds[m]}\t${utc.slice(0, 10)} ${utc.slice(11, 19)}\t60\t${gallons.toFixed(4)}\n`;
      if (csvChunk.length > 1 << 20) {
        if (!csv.write(csvChunk)) await once(csv, 'drain');
        if (!raw.write(rawChunk)) await once(raw, 'drain');
        csvChunk = rawChunk = '';
      }
    }
  }
  csv.end(csvChunk);
  raw.end(rawChunk);
  await Promise.all([once(csv, 'finish'), once(raw, 'finish')]);
}
const csvBytes = statSync(csvPath).size;
console.log(
  `generated ${ROWS.toLocaleString('en-US')} readings for ${METERS} meters: ${(csvBytes / 1e6).toFixed(1)} MB of CSV`,
);

// 3. The server in a child process; an API key for the upload.
const child: ChildProcess = fork(resolve(import.meta.dirname, 'bench-server.ts'), [], {
  env: { ...env, TSX_TSCONFIG_PATH: resolve(root, 'backend/tsconfig.json') },
  // BENCH_CPU_PROF=1 writes the server's CPU profile to .data/bench/prof/ (open it in Chrome DevTools).
  execArgv: [
    '--import',
    'tsx',
    '--expose-gc',
    ...(process.env['BENCH_CPU_PROF'] ? ['--cpu-prof', `--cpu-prof-dir=${resolve(dir, 'prof')}`] : []),
  ],
});
const ask = <T>(cmd: string): Promise<T> => {
  const reply = once(child, 'message') as Promise<[T]>;
  child.send({ cmd });
  return reply.then(([m]) => m);
};
const [{ url }] = (await once(child, 'message')) as [{ url: string }];
const key = await world.apiKey();
console.log(`server up at ${url}; uploading…`);

// 4. Upload through the API, streaming the file as multipart.
const loadBefore = loadavg()
  .map((l) => l.toFixed(1))
  .join(' ');
await ask('reset');
const boundary = `----rillmark-bench-${Date.now()}`;
const head = Buffer.from(
  `--${boundary}\r\nContent-Disposition: form-data; name="file"; ` +
    'filename="readings.csv"\r\nContent-Type: text/csv\r\n\r\n',
);
const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
const t0 = performance.now();
const response = await new Promise<{ status: number; body: string }>((done, fail) => {
  const req = request(
    `${url}/api/sites/${world.siteId}/uploads`,
    {
      method: 'POST',
      headers: {
        Authorization: `Bearer ${key}`,
        'Content-Type': `multipart/form-data; boundary=${boundary}`,
        'Content-Length': head.length + csvBytes + tail.length,
      },
    },
    (res) => {
      let body = '';
      res
        .setEncoding('utf8')
        .on('data', (c) => (body += c))
        .on('end', () => done({ status: res.statusCode ?? 0, body }));
    },
  );
  req.on('error', fail);
  req.write(head);
  createReadStream(csvPath)
    .on('end', () => req.end(tail))
    .pipe(req, { end: false });
});
const apiSeconds = (performance.now() - t0) / 1000;
console.log(`upload answered ${response.status} after ${apiSeconds.toFixed(1)} s; raw loads…`);
const memory = await ask<{ baseline: number; peak: number }>('rss');
if (response.status !== 201) throw new Error(`upload failed: ${response.status} ${response.body}`);
const upload = JSON.parse(response.body).upload;
if (upload.accepted !== ROWS) throw new Error(`expected ${ROWS} accepted, got ${upload.accepted}: ${response.body}`);

// 5. The same rows, raw LOAD DATA LOCAL INFILE into a scratch copy of meter_reading (same columns, key, upload
// index and meter foreign key: the table work any import must do), and, for comparison, into a bare table with
// the primary key only (what LOAD DATA can do when nothing else is maintained).
const conn = await createConnection({
  host: config.db.host,
  port: config.db.port,
  user: config.db.user,
  password: config.db.password,
  database: config.db.database,
});
const rawLoad = async (table: string, tail: string, values: unknown[] = []): Promise<number> => {
  const t = performance.now();
  await conn.query({
    sql:
      `LOAD DATA LOCAL INFILE 'readings.tsv' INTO TABLE ${table} FIELDS ` +
      `TERMINATED BY '\\t' LINES TERMINATED BY '\\n' ${tail}`,
    values,
    infileStreamFactory: () => createReadStream(rawPath),
  });
  const seconds = (performance.now() - t) / 1000;
  await conn.query(`DROP TABLE ${table}`);
  return seconds;
};
await conn.query('DROP TABLE IF EXISTS bench_raw_reading, bench_raw_reading_bare');
await conn.query('CREATE TABLE bench_raw_reading LIKE meter_reading');
await conn.query(
  `ALTER TABLE bench_raw_reading ADD CONSTRAINT fk_bench_raw_reading_meter FOREIGN KEY (meter_id)
    REFERENCES meter (id) ON DELETE CASCADE`,
);
const rawSeconds = await rawLoad(
  'bench_raw_reading',
  "(meter_id, start_utc, minutes, volume_gal) SET original_value = volume_gal, original_unit = 'gal', upload_id = ?",
  [upload.id],
);
await conn.query(
  `CREATE TABLE bench_raw_reading_bare (meter_id int unsigned NOT NULL, start_utc datetime NOT
    NULL, minutes mediumint unsigned NOT NULL, volume_gal decimal(12,4) NOT NULL, PRIMARY KEY
    (meter_id, start_utc, minutes)) ENGINE=InnoDB`,
);
const bareSeconds = await rawLoad('bench_raw_reading_bare', '(meter_id, start_utc, minutes, volume_gal)');
await conn.end();

// 6. Clean up: roll the upload back so the next run starts alike, stop the server.
await db.query('DELETE FROM meter_reading WHERE upload_id = ?', [upload.id]);
await db.query(`UPDATE upload SET status = 'rolled-back' WHERE id = ?`, [upload.id]);
const exited = once(child, 'exit');
child.send({ cmd: 'stop' });
await exited;
await db.destroy();

const apiRate = ROWS / apiSeconds;
const rawRate = ROWS / rawSeconds;
const growthMb = (memory.peak - memory.baseline) / (1024 * 1024);
console.log(
  `API upload:        ${apiSeconds.toFixed(2)} s, ${Math.round(apiRate).toLocaleString('en-US')} ` +
    'rows/s (send + parse + stage + merge, one transaction)',
);
console.log(
  `raw LOAD DATA:     ${rawSeconds.toFixed(2)} s, ${Math.round(rawRate).toLocaleString('en-US')} ` +
    'rows/s (into a copy of meter_reading: same columns, indexes, foreign key)',
);
console.log(`ratio API / raw:   ${(apiRate / rawRate).toFixed(2)}  (target ≥ 0.50)`);
console.log(
  'for comparison, raw LOAD DATA into a bare table (primary key ' +
    `only, 4 columns): ${bareSeconds.toFixed(2)} s, ${Math.round(ROWS / bareSeconds).toLocaleString('en-US')} ` +
    `rows/s; API / bare ${(apiRate / (ROWS / bareSeconds)).toFixed(2)}`,
);
console.log(
  `load average before ${loadBefore}, after ${loadavg()
    .map((l) => l.toFixed(1))
    .join(' ')} (${availableParallelism()} cores)`,
);
console.log(
  `server RSS growth: ${growthMb.toFixed(0)} MB peak during the ` +
    `upload (baseline ${(memory.baseline / 1048576).toFixed(0)} MB; target < 300 MB)`,
);
