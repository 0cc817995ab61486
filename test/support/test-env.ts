import { loadConfig, type Config } from '../../backend/src/config';

/** The API and e2e tests use their own database next to the development one, on the same MariaDB. */
export function testConfig(overrides: Record<string, string | undefined> = {}): Config {
  const base = loadConfig({ ...process.env, NODE_ENV: 'test' });
  return loadConfig({
    ...process.env,
    NODE_ENV: 'test',
    RILLMARK_DB_NAME: `${base.db.database}_test`,
    RILLMARK_PORT: '0',
    RILLMARK_LOG_LEVEL: 'warn',
    RILLMARK_SIGNIN_MAX_ATTEMPTS: '5',
    RILLMARK_JOBS_ENABLED: 'false',
    // Development features the tests exercise are switched on explicitly, as `npm start` does.
    RILLMARK_DEV_OUTBOX: 'true',
    ...overrides,
  });
}
