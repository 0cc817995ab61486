import { createPool, type Pool, type RowDataPacket } from 'mysql2/promise';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MariaDbRateLimitStore } from '../../backend/src/platform/auth/mariadb-rate-limit-store';
import { suffix } from '../support/test-app';
import { testConfig } from '../support/test-env';

let pool: Pool;
const hits = async (bucket: string) =>
  (await pool.query<RowDataPacket[]>('SELECT hits FROM rate_limit_hit WHERE bucket = ?', [bucket]))[0][0]?.['hits'] as
    number | undefined;

beforeAll(() => {
  const { db } = testConfig();
  pool = createPool({
    host: db.host,
    port: db.port,
    user: db.user,
    password: db.password,
    database: db.database,
    timezone: 'Z',
  });
});
afterAll(async () => pool?.end());

describe('sign-in counters in MariaDB', () => {
  it('when two stores (two app instances) count the same key, then they share one count', async () => {
    const key = `k-${suffix()}`;
    const a = new MariaDbRateLimitStore(pool, 'test');
    const b = new MariaDbRateLimitStore(pool, 'test');
    a.init({ windowMs: 60_000 } as never);
    b.init({ windowMs: 60_000 } as never);
    await a.increment(key);
    await b.increment(key);
    expect((await a.increment(key)).totalHits).toBe(3);
    await b.decrement(key);
    expect(await hits(`test:${key}`)).toBe(2);
  });

  it('when the window has passed, then the count starts again at one and prune drops the old row', async () => {
    const store = new MariaDbRateLimitStore(pool, 'test');
    store.init({ windowMs: 60_000 } as never);
    const stale = `stale-${suffix()}`;
    await pool.query('INSERT INTO rate_limit_hit (bucket, hits, reset_at) VALUES (?, 7, ?)', [
      `test:${stale}`,
      new Date(Date.now() - 1_000),
    ]);
    expect((await store.increment(stale)).totalHits).toBe(1);
    const gone = `gone-${suffix()}`;
    await pool.query('INSERT INTO rate_limit_hit (bucket, hits, reset_at) VALUES (?, 3, ?)', [
      `test:${gone}`,
      new Date(Date.now() - 1_000),
    ]);
    await store.prune();
    expect(await hits(`test:${gone}`)).toBeUndefined();
    expect(await hits(`test:${stale}`)).toBe(1);
  });
});
