/**
 * Keeps the Rillmark server running for `npm start`: starts it, and when it dies restarts it with back-off and
 * one log line saying why (exit code or signal, and the last error it logged). MariaDB, the fake SMTP server and
 * the weather feed are left alone: one bad request must not take the whole stack down. A server that refuses its
 * configuration (exit 78) is not restarted. SIGINT/SIGTERM stop the server and then the supervisor.
 *
 *   node --import tsx ops/supervise/supervise.ts -- node --enable-source-maps dist/server/main.js
 *
 * Production uses systemd instead (ops/systemd/rillmark.service): same policy, same exit codes.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { createInterface } from 'node:readline';
import { restartDelayMs, whyItStopped } from './restart-policy';

const separator = process.argv.indexOf('--');
const command = separator === -1 ? [] : process.argv.slice(separator + 1);
if (command.length === 0) {
  console.error('usage: supervise.ts -- <command> [args…]');
  process.exit(64);
}
/** A run this long counts as healthy: the next crash starts the back-off again from the first step. */
const HEALTHY_RUN_MS = Number(process.env['RILLMARK_SUPERVISE_HEALTHY_MS'] ?? 60_000);
const FIRST_DELAY_MS = Number(process.env['RILLMARK_SUPERVISE_FIRST_DELAY_MS'] ?? 1_000);

const say = (message: string) => process.stderr.write(`${new Date().toISOString()} SUPERVISOR ${message}\n`);

let child: ChildProcess | null = null;
let stopping = false;
let failures = 0;
let timer: NodeJS.Timeout | null = null;

function start(): void {
  const startedAt = Date.now();
  let lastError = '';
  child = spawn(command[0]!, command.slice(1), { stdio: ['ignore', 'inherit', 'pipe'] });
  say(`started the server (pid ${child.pid})`);
  // The server's stderr is passed through; its last error line is remembered to explain an exit.
  createInterface({ input: child.stderr! }).on('line', (line) => {
    process.stderr.write(line + '\n');
    if (/\bERROR\b/.test(line) || /^\w*Error\b/.test(line)) lastError = line;
  });
  child.on('exit', (code, signal) => {
    child = null;
    if (stopping) return void process.exit(0);
    const why = whyItStopped(code, signal, lastError);
    if (code === 78) {
      say(`the server refused to start (${why}); not restarting: fix the configuration and run again`);
      return void process.exit(78);
    }
    failures = Date.now() - startedAt >= HEALTHY_RUN_MS ? 1 : failures + 1;
    const delay = restartDelayMs(failures, FIRST_DELAY_MS);
    say(`the server stopped (${why}); restart ${failures} in ${Math.round(delay / 100) / 10} s`);
    timer = setTimeout(start, delay);
  });
}

function stop(signal: NodeJS.Signals): void {
  if (stopping) return;
  stopping = true;
  if (timer) clearTimeout(timer);
  if (!child) process.exit(0);
  say(`${signal}: stopping the server`);
  child.kill('SIGTERM');
  // A server that does not stop within 30 s is killed.
  setTimeout(() => child?.kill('SIGKILL'), 30_000).unref();
}

process.on('SIGINT', () => stop('SIGINT'));
process.on('SIGTERM', () => stop('SIGTERM'));
start();
