/** What the supervisor says about an exit, and how long it waits before the next start. */

/** Exit codes the server uses (backend/src/platform/process-guards.ts), in words. */
const MEANINGS: Record<number, string> = {
  0: 'it stopped normally',
  1: 'it failed',
  69: 'MariaDB could not be reached at start',
  70: 'an uncaught exception',
  78: 'its configuration was refused',
};

const SIGNALS: Record<string, string> = {
  SIGKILL: 'killed (SIGKILL: by hand, or by the kernel when memory ran out)',
  SIGTERM: 'asked to stop (SIGTERM) by someone else',
  SIGSEGV: 'crashed in native code (SIGSEGV)',
  SIGABRT: 'aborted (SIGABRT, e.g. out of heap memory)',
};

export function whyItStopped(code: number | null, signal: string | null, lastError: string): string {
  const what =
    signal !== null
      ? (SIGNALS[signal] ?? `killed by ${signal}`)
      : `exit code ${code}${MEANINGS[code ?? -1] ? `: ${MEANINGS[code ?? -1]}` : ''}`;
  const error = lastError.trim();
  return error ? `${what}; its last error: ${error.slice(0, 300)}` : what;
}

/** 1 s, 2 s, 4 s … doubling per crash in a row, at most 30 s (restart loops must not spin). */
export function restartDelayMs(failuresInARow: number, firstMs = 1_000, maxMs = 30_000): number {
  return Math.min(maxMs, firstMs * 2 ** Math.max(0, failuresInARow - 1));
}
