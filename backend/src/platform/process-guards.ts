import { logger } from './logger';

/**
 * Exit codes the supervisor (ops/supervise, or systemd's RestartPreventExitStatus) reads: a configuration the
 * server refuses will not fix itself by restarting; anything else is worth a restart with back-off.
 * Values from sysexits.h (EX_CONFIG, EX_SOFTWARE, EX_UNAVAILABLE).
 */
export const EXIT = { config: 78, crashed: 70, databaseUnreachable: 69 } as const;

/** A start-up problem that restarting cannot fix (bad configuration, MariaDB refusing our credentials). */
export class ConfigurationProblem extends Error {}

interface ProcessLike {
  on(event: 'unhandledRejection', listener: (reason: unknown) => void): unknown;
  on(event: 'uncaughtException', listener: (err: Error) => void): unknown;
  exit(code: number): never;
}

function describe(value: unknown): string {
  return value instanceof Error ? (value.stack ?? `${value.name}: ${value.message}`) : String(value);
}

/**
 * A promise rejected with nobody listening is a bug, but the request it belonged to has already failed: log it
 * and keep serving. An uncaught exception leaves the process in an unknown state: log it and exit, so the
 * supervisor starts a clean one.
 */
export function installProcessGuards(proc: ProcessLike = process): void {
  proc.on('unhandledRejection', (reason) => {
    logger.error('unhandled promise rejection (the server keeps running)', { error: describe(reason) });
  });
  proc.on('uncaughtException', (err) => {
    logger.error('uncaught exception: exiting so the supervisor starts a clean process', { error: describe(err) });
    proc.exit(EXIT.crashed);
  });
}
