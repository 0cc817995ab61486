import { spawn } from 'node:child_process';
import { rmSync } from 'node:fs';
import { resolve } from 'node:path';
import { createInterface } from 'node:readline';
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { connectWithRetry } from '../../backend/src/db/connect';
import { createDataSource } from '../../backend/src/db/data-source';
import { Client, createSite, createWorld, suffix, type World } from '../support/test-app';
import { testConfig } from '../support/test-env';
import {
  eventually,
  FAULT,
  faultDbPid,
  mailsMatching,
  sleep,
  startFakeSmtpProcess,
  startFaultDb,
  stopFaultDb,
  stopProcess,
} from './fault-stack';
import { sendMultipart } from './multipart-sender';
import { ROOT, startServerProcess, type ServerProcess } from './server-process';

/**
 * Faults with real processes: MariaDB killed in the middle of an upload and started again, MariaDB paused for 10 s,
 * the SMTP server down, the app server killed under its supervisor. Everything runs against a MariaDB and a fake
 * SMTP server of these tests' own (ports from this worktree's slot), never the ones the other tests share.
 */
const config = testConfig({ RILLMARK_DB_PORT: String(FAULT.dbPort), RILLMARK_DB_NAME: FAULT.dbName });
const uploadDir = resolve(ROOT, `.data/test-uploads/faults-${suffix()}`);
const serverEnv = {
  NODE_ENV: 'test',
  RILLMARK_DB_PORT: String(FAULT.dbPort),
  RILLMARK_DB_NAME: config.db.database,
  RILLMARK_SMTP_PORT: String(FAULT.smtpPort),
  RILLMARK_FAKE_SMTP_HTTP_PORT: String(FAULT.smtpHttpPort),
  RILLMARK_UPLOAD_DIR: uploadDir,
  RILLMARK_DEV_OUTBOX: 'false',
  // Mail delivery runs here, looking for due mail every second; retries after 2, 4, 10, 20 … s (1 min in production).
  RILLMARK_JOBS_ENABLED: 'true',
  RILLMARK_MAIL_POLL_SECONDS: '1',
  RILLMARK_MAIL_RETRY_SECONDS: '2',
};
const METERS = ['FX-01', 'FX-02', 'FX-03', 'FX-04'];

let db: DataSource;
let server: ServerProcess;
let smtp: Awaited<ReturnType<typeof startFakeSmtpProcess>> | undefined;
let world: World;
let siteId: number;

async function signedIn(email: string): Promise<Client> {
  const client = new Client(server.url);
  const res = await client.signIn(email);
  if (res.status !== 200) throw new Error(`sign-in as ${email}: ${res.status} ${JSON.stringify(res.body)}`);
  return client;
}

/** A request with a deadline: the status, or 0 when no answer came in time. */
async function statusWithin(ms: number, path: string, init: RequestInit = {}): Promise<number> {
  try {
    return (await fetch(`${server.url}${path}`, { ...init, signal: AbortSignal.timeout(ms) })).status;
  } catch {
    return 0;
  }
}

function cookieOf(client: Client): Promise<{ cookie: string; csrf: string }> {
  return client
    .get('/api/auth/me')
    .then((r) => r.request.cookies as string)
    .then((cookie) => ({ cookie, csrf: decodeURIComponent(/XSRF-TOKEN=([^;]+)/.exec(cookie)?.[1] ?? '') }));
}

beforeAll(async () => {
  await startFaultDb();
  db = createDataSource(config.db);
  await connectWithRetry(db, { attempts: 20 });
  await db.runMigrations({ transaction: 'each' });
  world = await createWorld(db);
  siteId = (await createSite(db, world.org.id, { timeZone: 'UTC' })).id;
  smtp = await startFakeSmtpProcess();
  server = await startServerProcess(serverEnv);
  const manager = await signedIn(world.users.manager.email);
  for (const ref of METERS) {
    await manager
      .post(`/api/sites/${siteId}/meters`, {
        ref,
        unit: 'gal',
        registerMultiplier: 1,
        registerDigits: null,
        purpose: 'dedicated-irrigation',
        waterSource: 'potable',
        installedAt: '2020-01-01T00:00:00.000Z',
        removedAt: null,
        previousRegisters: [],
      })
      .expect(201);
  }
}, 180_000);

afterAll(async () => {
  await server?.stop();
  await stopProcess(smtp);
  await db?.destroy().catch(() => undefined);
  await stopFaultDb().catch(() => undefined);
  rmSync(uploadDir, { recursive: true, force: true });
});

describe('MariaDB paused for 10 s (finding 5)', () => {
  it(
    'when MariaDB stops answering, ' +
      'then health says down within 2 s, requests get a clear 503 within seconds, and service comes back by itself',
    async () => {
      const manager = await signedIn(world.users.manager.email);
      const { cookie, csrf } = await cookieOf(manager);
      const pid = faultDbPid();
      process.kill(pid, 'SIGSTOP');
      const resumed = sleep(10_000).then(() => process.kill(pid, 'SIGCONT'));
      try {
        // A read already on its way when MariaDB stops is answered 503 as soon as the stall is seen.
        const early = fetch(`${server.url}/api/sites`, { headers: { cookie }, signal: AbortSignal.timeout(8_000) });
        const ready = await fetch(`${server.url}/api/health/ready`, { signal: AbortSignal.timeout(2_500) });
        expect(ready.status).toBe(503);
        expect(await ready.json()).toMatchObject({ database: { status: 'down' } });
        expect(await statusWithin(2_500, '/api/health')).toBe(503);
        expect((await early).status).toBe(503);
        expect(await statusWithin(5_000, '/api/health/live')).toBe(200);

        const listed = await fetch(`${server.url}/api/sites`, {
          headers: { cookie },
          signal: AbortSignal.timeout(5_000),
        });
        expect(listed.status).toBe(503);
        expect(((await listed.json()) as { error: { code: string; message: string } }).error).toMatchObject({
          code: 'database_unavailable',
          message: expect.stringMatching(/database is not answering/),
        });
        const name = `Paused ${suffix()}`;
        const created = await fetch(`${server.url}/api/sites`, {
          method: 'POST',
          headers: { cookie, 'x-xsrf-token': csrf, 'content-type': 'application/json' },
          body: JSON.stringify({ name, kind: 'park', address: '1 Pause Way', timeZone: 'UTC' }),
          signal: AbortSignal.timeout(5_000),
        });
        expect(created.status).toBe(503);
        await resumed;
        expect(await eventually(async () => (await statusWithin(5_000, '/api/health/ready')) === 200, 20_000)).toBe(
          true,
        );
        const after = await manager.get(`/api/sites?q=${encodeURIComponent(name)}`).expect(200);
        expect(after.body.total).toBe(0);
        expect(server.exit).toBeNull();
      } finally {
        await resumed.catch(() => process.kill(pid, 'SIGCONT'));
      }
    },
  );
});

describe('the SMTP server down', () => {
  it(
    'when SMTP is down while mail is sent, ' +
      'then the message waits queued and is delivered exactly once when SMTP is back',
    async () => {
      const admin = await signedIn(world.users.admin.email);
      await stopProcess(smtp);
      const down = Date.now();
      await admin.post(`/api/users/${world.users.auditor.id}/password-reset`).expect(202);
      const queued = async () =>
        (
          await db.query(
            `SELECT status, attempts FROM mail_message WHERE to_address = ? AND subject LIKE '%password%'
           ORDER BY id DESC LIMIT 1`,
            [world.users.auditor.email],
          )
        )[0] as { status: string; attempts: number } | undefined;
      // Outage of 12 s (instead of a minute: the retry base is 2 s here), long enough for several failed attempts.
      expect(await eventually(async () => ((await queued())?.attempts ?? 0) >= 2, 12_000)).toBe(true);
      await sleep(Math.max(0, down + 12_000 - Date.now()));
      expect((await queued())?.status).toBe('queued');
      smtp = await startFakeSmtpProcess();
      expect(await eventually(async () => (await mailsMatching(world.users.auditor.email)) >= 1, 40_000)).toBe(true);
      await sleep(3_000);
      expect(await mailsMatching(world.users.auditor.email)).toBe(1);
      expect(await queued()).toMatchObject({ status: 'sent' });
    },
  );
});

describe('MariaDB killed in the middle of an upload', () => {
  it(
    'when MariaDB dies mid-load and is started again, ' +
      'then the upload is stored whole or not at all, the user is told, and the server reconnects by itself',
    async () => {
      const manager = await signedIn(world.users.manager.email);
      const { cookie, csrf } = await cookieOf(manager);
      const rows = 160_000;
      let killed = false;
      const pid = faultDbPid();
      const clientRef = `kill-${suffix()}`;
      async function* file(): AsyncGenerator<Buffer> {
        yield Buffer.from('Meter #,Interval Start,Interval (min),Usage (Gal)\n');
        const start = Date.UTC(2022, 0, 1);
        let chunk = '';
        for (let i = 0; i < rows; i++) {
          const at = new Date(start + Math.floor(i / METERS.length) * 15 * 60_000).toISOString().slice(0, 16);
          chunk += `${METERS[i % METERS.length]},${at.replace('T', ' ')},15,${(i % 97) / 10}\n`;
          if (chunk.length > 64 * 1024) {
            yield Buffer.from(chunk);
            chunk = '';
            // Once a third is on its way, MariaDB is killed while it loads the rows.
            if (!killed && i > rows / 3) {
              await sleep(300);
              process.kill(pid, 'SIGKILL');
              killed = true;
            }
          }
        }
        yield Buffer.from(chunk);
      }
      const answer = await sendMultipart({
        url: `${server.url}/api/sites/${siteId}/uploads`,
        headers: { cookie, 'x-xsrf-token': csrf },
        fields: { clientRef },
        fileName: 'killed.csv',
        file: file(),
      });
      expect(killed).toBe(true);
      expect(answer.status).toBe(503);
      expect(JSON.parse(answer.body).error.message).toMatch(
        /^"killed\.csv": the database stopped answering .* stored whole or not at all; send the same file again/,
      );
      expect(server.exit).toBeNull();

      await startFaultDb();
      expect(await eventually(async () => (await statusWithin(3_000, '/api/health/ready')) === 200, 30_000)).toBe(true);
      // Whole or absent, and the failure is recorded once MariaDB is back (the server retries writing it).
      const outcome = async () => {
        const [upload] = await db.query('SELECT id, status FROM upload WHERE client_ref = ?', [clientRef]);
        if (!upload) return { status: 'absent', stored: 0 };
        const [{ n }] = await db.query('SELECT COUNT(*) AS n FROM meter_reading WHERE upload_id = ?', [upload.id]);
        return { status: String(upload.status), stored: Number(n) };
      };
      expect(await eventually(async () => (await outcome()).status !== 'processing', 20_000)).toBe(true);
      const { status, stored } = await outcome();
      expect([0, rows]).toContain(stored);
      expect(status === 'done').toBe(stored === rows);

      // The server serves normally again: the same file goes in whole.
      const again = await sendMultipart({
        url: `${server.url}/api/sites/${siteId}/uploads`,
        headers: { cookie, 'x-xsrf-token': csrf },
        fields: { clientRef: `${clientRef}-again` },
        fileName: 'killed.csv',
        file: (async function* () {
          killed = true;
          yield* file();
        })(),
      });
      expect([200, 201]).toContain(again.status);
      expect(server.exit).toBeNull();
    },
  );
});

describe('the app server dies under its supervisor', () => {
  it(
    'when the server is killed, ' + 'then the supervisor says why and starts it again, and MariaDB keeps running',
    async () => {
      const child = spawn(
        process.execPath,
        [
          '--import',
          'tsx',
          'ops/supervise/supervise.ts',
          '--',
          process.execPath,
          '--import',
          'tsx',
          'backend/src/main.ts',
        ],
        {
          cwd: ROOT,
          env: {
            ...process.env,
            ...serverEnv,
            RILLMARK_JOBS_ENABLED: 'false',
            RILLMARK_PORT: '0',
            TSX_TSCONFIG_PATH: resolve(ROOT, 'backend/tsconfig.json'),
          },
          stdio: ['ignore', 'pipe', 'pipe'],
        },
      );
      const lines: string[] = [];
      createInterface({ input: child.stdout! }).on('line', (l) => lines.push(l));
      createInterface({ input: child.stderr! }).on('line', (l) => lines.push(l));
      const urls = () => lines.map((l) => /listening on (http:\/\/\S+)/.exec(l)?.[1]).filter(Boolean) as string[];
      try {
        expect(await eventually(async () => urls().length === 1, 30_000)).toBe(true);
        const first = Number(/started the server \(pid (\d+)\)/.exec(lines.join('\n'))?.[1]);
        process.kill(first, 'SIGKILL');
        expect(await eventually(async () => urls().length === 2, 30_000)).toBe(true);
        expect(lines.join('\n')).toMatch(/SUPERVISOR the server stopped \(killed \(SIGKILL.*\); restart 1 in 1 s/);
        const res = await fetch(`${urls()[1]}/api/health/ready`);
        expect(res.status).toBe(200);
        expect(() => process.kill(faultDbPid(), 0)).not.toThrow();
      } finally {
        await stopProcess(child);
      }
    },
  );

  it('when the server refuses its configuration, then the supervisor does not restart it', async () => {
    const child = spawn(
      process.execPath,
      [
        '--import',
        'tsx',
        'ops/supervise/supervise.ts',
        '--',
        process.execPath,
        '--import',
        'tsx',
        'backend/src/main.ts',
      ],
      {
        cwd: ROOT,
        env: {
          ...process.env,
          ...serverEnv,
          NODE_ENV: 'production',
          TSX_TSCONFIG_PATH: resolve(ROOT, 'backend/tsconfig.json'),
        },
        stdio: ['ignore', 'ignore', 'pipe'],
      },
    );
    const lines: string[] = [];
    createInterface({ input: child.stderr! }).on('line', (l) => lines.push(l));
    const exited = new Promise<number | null>((done) => child.once('exit', done));
    const code = await Promise.race([exited, sleep(90_000).then(() => 'still running')]);
    if (code === 'still running') await stopProcess(child);
    expect(code).toBe(78);
    expect(lines.join('\n')).toMatch(/RILLMARK_SESSION_SECRET: still the development value/);
    expect(lines.join('\n')).toMatch(/refused to start .*not restarting/);
    expect(lines.filter((l) => /started the server/.test(l))).toHaveLength(1);
  });
});
