import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { createInterface } from 'node:readline';

export const ROOT = resolve(import.meta.dirname, '../..');

/**
 * The real server in a child process (`node --import tsx backend/src/main.ts`, as `npm run serve:api` runs it),
 * so a crash is an exit the test sees instead of taking the test runner with it, and its memory is its own.
 */
export interface ServerProcess {
  url: string;
  pid: number;
  child: ChildProcess;
  /** Exit code or signal once it has exited; null while it runs. */
  exit: { code: number | null; signal: string | null } | null;
  /** Its last output lines (stdout and stderr), for the failure message of a test. */
  tail: string[];
  /** Resident memory now, in MB (Linux /proc). */
  rssMb(): number;
  stop(): Promise<void>;
}

/** Starts the server with these settings on top of the test's environment; resolves once it listens. */
export async function startServerProcess(env: Record<string, string | undefined>): Promise<ServerProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'backend/src/main.ts'], {
    cwd: ROOT,
    env: {
      ...process.env,
      TSX_TSCONFIG_PATH: resolve(ROOT, 'backend/tsconfig.json'),
      RILLMARK_PORT: '0',
      RILLMARK_LOG_LEVEL: 'info',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const server = {
    url: '',
    pid: child.pid!,
    child,
    exit: null,
    tail: [],
    rssMb: () => rssMb(child.pid!),
    stop: () => stopChild(child),
  } as ServerProcess;
  const remember = (line: string) => {
    server.tail.push(line);
    if (server.tail.length > 300) server.tail.splice(0, 100);
  };
  createInterface({ input: child.stderr! }).on('line', remember);
  const listening = new Promise<string>((resolveUrl, reject) => {
    createInterface({ input: child.stdout! }).on('line', (line) => {
      remember(line);
      const url = /listening on (http:\/\/\S+)/.exec(line)?.[1];
      if (url) resolveUrl(url);
    });
    child.once('exit', (code, signal) => {
      server.exit = { code, signal };
      reject(new Error(`the server exited before listening (${code ?? signal}):\n${server.tail.join('\n')}`));
    });
  });
  server.url = await listening;
  return server;
}

function rssMb(pid: number): number {
  try {
    const kb = /VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))?.[1];
    return kb ? Number(kb) / 1024 : 0;
  } catch {
    return 0;
  }
}

async function stopChild(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise<void>((done) => child.once('exit', () => done()));
  child.kill('SIGTERM');
  const timer = setTimeout(() => child.kill('SIGKILL'), 10_000);
  await exited;
  clearTimeout(timer);
}
