import type { DataSource } from 'typeorm';
import { logger } from '../platform/logger';
import { ConfigurationProblem } from '../platform/process-guards';

/** MariaDB refused our credentials or database: retrying cannot help, so the first one stops the start. */
const REFUSED = new Set([
  'ER_ACCESS_DENIED_ERROR',
  'ER_DBACCESS_DENIED_ERROR',
  'ER_BAD_DB_ERROR',
  'ER_NOT_SUPPORTED_AUTH_MODE',
]);

/**
 * Connects, retrying with back-off while the database is down, and says so plainly each time
 * (a server started before MariaDB waits for it instead of crash-looping silently). Wrong credentials or an unknown
 * database stop at once: no number of retries fixes them.
 */
export async function connectWithRetry(
  dataSource: DataSource,
  { attempts = 30, firstDelayMs = 500, maxDelayMs = 5_000 } = {},
): Promise<void> {
  const { host, port, database } = dataSource.options as { host?: string; port?: number; database?: string };
  let delay = firstDelayMs;
  for (let attempt = 1; ; attempt++) {
    try {
      await dataSource.initialize();
      if (attempt > 1) logger.info(`connected to MariaDB at ${host}:${port}/${database} after ${attempt} attempts`);
      return;
    } catch (err) {
      const reason = (err as { code?: string; message?: string }).code ?? (err as Error).message;
      if (REFUSED.has(reason)) {
        throw new ConfigurationProblem(
          `MariaDB at ${host}:${port} refused user or database "${database}" ` +
            `(${reason}: ${(err as Error).message}). ` +
            'Check RILLMARK_DB_USER, RILLMARK_DB_PASSWORD and RILLMARK_DB_NAME; not retrying.',
        );
      }
      if (attempt >= attempts) {
        throw new Error(
          `Cannot reach MariaDB at ${host}:${port}/${database} after ${attempts} ` +
            `attempts (${reason}). Is it running? Start it with: npm run db:start`,
        );
      }
      logger.warn(
        `MariaDB at ${host}:${port}/${database} is not reachable (${reason}); ` +
          `retry ${attempt}/${attempts - 1} in ${delay} ms`,
      );
      await new Promise((r) => setTimeout(r, delay));
      delay = Math.min(maxDelayMs, delay * 2);
    }
  }
}
