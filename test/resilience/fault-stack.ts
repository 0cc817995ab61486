import { execFile, spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { promisify } from 'node:util';
import { ROOT } from './server-process';

const run = promisify(execFile);

/**
 * A MariaDB and a fake SMTP server of the fault tests' own (they are killed and paused on purpose, so never the ones
 * the other tests use). Ports come from this worktree's slot: 5000 + 100·n … (TEAM.md), n read from
 * RILLMARK_DB_PORT = 3320 + n; RILLMARK_TEST_PORT_BASE overrides.
 */
function portBase(): number {
  const given = Number(process.env['RILLMARK_TEST_PORT_BASE']);
  if (Number.isInteger(given) && given > 0) return given;
  const slot = Number(process.env['RILLMARK_DB_PORT'] ?? 3317) - 3320;
  return 5000 + 100 * (slot >= 0 && slot <= 9 ? slot : 0);
}

const base = portBase();
export const FAULT = {
  dbPort: base + 10,
  dbDir: resolve(ROOT, '.data/fault-mariadb'),
  dbName: 'rillmark_fault',
  smtpPort: base + 20,
  smtpHttpPort: base + 21,
  smtpFile: resolve(ROOT, '.data/fault-mail/messages.jsonl'),
};

/** What the fault MariaDB and servers need on top of the environment (credentials stay the project's). */
export const faultDbEnv = {
  RILLMARK_DB_PORT: String(FAULT.dbPort),
  RILLMARK_DB_DIR: FAULT.dbDir,
  RILLMARK_DB_NAME: FAULT.dbName,
  RILLMARK_DB_BUFFER_POOL: '64M',
};

/** Starts (or finds running) the fault MariaDB with ops/db/start.sh, as `npm start` would. */
export async function startFaultDb(): Promise<void> {
  await run('bash', [resolve(ROOT, 'ops/db/start.sh')], { env: { ...process.env, ...faultDbEnv }, cwd: ROOT });
}

export async function stopFaultDb(): Promise<void> {
  await run('bash', [resolve(ROOT, 'ops/db/stop.sh')], { env: { ...process.env, ...faultDbEnv }, cwd: ROOT });
}

export function faultDbPid(): number {
  return Number(readFileSync(resolve(FAULT.dbDir, 'mariadb.pid'), 'utf8').trim());
}

/** The fake SMTP server as its own process (stopped and started again by the mail fault test). */
export async function startFakeSmtpProcess(): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'ops/mail/fake-smtp-server.ts'], {
    cwd: ROOT,
    env: {
      ...process.env,
      RILLMARK_SMTP_PORT: String(FAULT.smtpPort),
      RILLMARK_FAKE_SMTP_HTTP_PORT: String(FAULT.smtpHttpPort),
      RILLMARK_FAKE_SMTP_FILE: FAULT.smtpFile,
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  await new Promise<void>((ready, fail) => {
    child.stdout!.on('data', (d: Buffer) => /fake SMTP on/.test(d.toString()) && ready());
    child.once('exit', (code) => fail(new Error(`fake SMTP exited (${code})`)));
  });
  return child;
}

export async function stopProcess(child: ChildProcess | undefined): Promise<void> {
  if (!child || child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise((done) => child.once('exit', done));
  child.kill('SIGTERM');
  await exited;
}

/** Messages the fault fake SMTP server received with this subject fragment. */
export async function mailsMatching(fragment: string): Promise<number> {
  try {
    const res = await fetch(`http://127.0.0.1:${FAULT.smtpHttpPort}/messages`, { signal: AbortSignal.timeout(3_000) });
    const { messages } = (await res.json()) as { messages: Array<{ to: string; subject: string }> };
    return messages.filter((m) => m.to.includes(fragment) || m.subject.includes(fragment)).length;
  } catch {
    return -1;
  }
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Polls `check` every 250 ms until it returns true or `ms` pass; returns whether it did. */
export async function eventually(check: () => Promise<boolean>, ms: number): Promise<boolean> {
  const until = Date.now() + ms;
  for (;;) {
    if (await check().catch(() => false)) return true;
    if (Date.now() > until) return false;
    await sleep(250);
  }
}
