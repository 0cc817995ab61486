import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { DatabaseWatch, PING_TIMEOUT_MS } from '../../backend/src/db/database-watch';
import { startServer } from '../../backend/src/server';
import { ConfigurationProblem } from '../../backend/src/platform/process-guards';
import { createTestApp, type TestApp } from '../support/test-app';
import { testConfig } from '../support/test-env';

let app: TestApp;

beforeAll(async () => {
  app = await createTestApp();
});
afterAll(async () => app?.stop());

describe('MariaDB durability (finding 7)', () => {
  it(
    'when a transaction commits, ' + 'then MariaDB has flushed its log to disk (innodb_flush_log_at_trx_commit = 1)',
    async () => {
      const [row] = await app.db.query(
        'SELECT @@GLOBAL.innodb_flush_log_at_trx_commit AS flush, @@GLOBAL.sync_binlog AS syncBinlog',
      );
      expect(Number(row.flush)).toBe(1);
      expect(Number(row.syncBinlog)).toBe(1);
    },
  );
});

describe('database credentials', () => {
  it('when MariaDB refuses the password, then the server stops at once without retrying', async () => {
    const lines: string[] = [];
    const spy = vi.spyOn(process.stderr, 'write').mockImplementation((chunk) => (lines.push(String(chunk)), true));
    try {
      const refused = startServer(testConfig({ RILLMARK_DB_PASSWORD: 'not-the-password' }), { dbAttempts: 30 });
      await expect(refused).rejects.toThrow(ConfigurationProblem);
      await expect(refused).rejects.toThrow(/refused user or database .*ER_ACCESS_DENIED_ERROR.*not retrying/);
    } finally {
      spy.mockRestore();
    }
    expect(lines.filter((l) => /retry \d+\/\d+/.test(l))).toEqual([]);
  });
});

describe('health', () => {
  it(
    'when the process runs, ' + 'then liveness answers without asking MariaDB, and readiness says the database is up',
    async () => {
      const live = await fetch(`${app.server.url}/api/health/live`);
      expect(live.status).toBe(200);
      const ready = await fetch(`${app.server.url}/api/health/ready`);
      expect(ready.status).toBe(200);
      expect(await ready.json()).toMatchObject({ status: 'ok', database: { status: 'up' } });
    },
  );

  it('when the event loop is busy past the ping deadline, then an answer MariaDB sent meanwhile counts', async () => {
    const watch = new DatabaseWatch(testConfig().db);
    expect((await watch.check()).status).toBe('up');
    const ping = watch.check();
    await new Promise((sent) => setImmediate(sent));
    // A large file being parsed holds the event loop: the answer and the deadline are both due when it frees.
    const until = Date.now() + PING_TIMEOUT_MS + 500;
    while (Date.now() < until);
    expect((await ping).status).toBe('up');
    await watch.stop();
  });
});
