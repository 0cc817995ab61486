import { execFileSync } from 'node:child_process';
import { createConnection } from 'node:net';
import { resolve } from 'node:path';
import { createConnection as createDbConnection } from 'mysql2/promise';
import { connectWithRetry } from '../../backend/src/db/connect';
import { createDataSource } from '../../backend/src/db/data-source';
import { setLogLevel } from '../../backend/src/platform/logger';
import { testConfig } from './test-env';

const root = resolve(import.meta.dirname, '../..');

function portAnswers(host: string, port: number): Promise<boolean> {
  return new Promise((done) => {
    const socket = createConnection({ host, port });
    socket.once('connect', () => (socket.destroy(), done(true)));
    socket.once('error', () => done(false));
  });
}

/**
 * Once per test run: start MariaDB, the fake SMTP server and the fake weather feed if their ports are silent (the
 * README's
 * test command starts them already), then migrate the test database.
 */
export default async function setup(): Promise<void> {
  setLogLevel('warn');
  const config = testConfig();
  if (!(await portAnswers(config.db.host, config.db.port))) {
    execFileSync('bash', [resolve(root, 'ops/db/start.sh')], { stdio: 'inherit' });
  }
  if (!(await portAnswers(config.mail.host, config.mail.fakeServerHttpPort))) {
    execFileSync('bash', [resolve(root, 'ops/mail/start.sh')], { stdio: 'inherit' });
  }
  const feed = new URL(config.weather.feedUrl);
  if (!(await portAnswers(feed.hostname, Number(feed.port || 80)))) {
    execFileSync('bash', [resolve(root, 'ops/weather/start.sh')], {
      stdio: 'inherit',
      env: { ...process.env, RILLMARK_FAKE_WEATHER_PORT: feed.port || '80' },
    });
  }
  const admin = await createDbConnection({
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
  await connectWithRetry(db, { attempts: 10 });
  await db.runMigrations({ transaction: 'each' });
  await db.destroy();
}
