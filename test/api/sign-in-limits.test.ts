import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  Client,
  createTestApp,
  createUser,
  createWorld,
  TEST_PASSWORD,
  type TestApp,
  type World,
} from '../support/test-app';

/** The test configuration allows 5 failed sign-ins (per address and account, and per account before delays). */
let app: TestApp;
let proxied: TestApp;
let world: World;

beforeAll(async () => {
  app = await createTestApp();
  // As behind a reverse proxy on this machine: X-Forwarded-For names the client.
  proxied = await createTestApp({ RILLMARK_TRUST_PROXY: 'loopback' });
  world = await createWorld(app.db);
});
afterAll(async () => Promise.all([app?.stop(), proxied?.stop()]));

async function signIn(on: TestApp, email: string, password: string, forwardedFor?: string) {
  const client = new Client(on.server.url);
  await client.fetchCsrf();
  const req = client.post('/api/auth/sign-in', { email, password });
  if (forwardedFor) req.set('X-Forwarded-For', forwardedFor);
  return req;
}

const wait = (seconds: number) => new Promise((r) => setTimeout(r, seconds * 1000 + 50));

describe('only wrong passwords count (finding 3)', () => {
  it(
    'when 50 people sign in to one account at the same moment with the right password, ' + 'then all 50 are signed in',
    async () => {
      const user = await createUser(app.db, world.org.id, 'manager');
      const answers = await Promise.all(Array.from({ length: 50 }, () => signIn(app, user.email, TEST_PASSWORD)));
      expect(answers.map((r) => r.status)).toEqual(Array(50).fill(200));
      expect((await signIn(app, user.email, TEST_PASSWORD)).status).toBe(200);
    },
  );

  it('when wrong passwords are refused with 429, then the refusals do not count and the wait stays short', async () => {
    const user = await createUser(app.db, world.org.id, 'auditor');
    for (let i = 0; i < 5; i++)
      expect((await signIn(proxied, user.email, 'wrong', `198.51.100.${i}`)).status).toBe(401);
    const refused = await Promise.all([1, 2, 3].map((i) => signIn(proxied, user.email, 'wrong', `203.0.113.${i}`)));
    expect(refused.map((r) => r.status)).toEqual([429, 429, 429]);
    // The first delay after the cap is 1 s; the three refusals above did not make it longer.
    await wait(Number(refused[2]!.headers['retry-after']));
    expect((await signIn(proxied, user.email, TEST_PASSWORD, '192.0.2.200')).status).toBe(200);
  });
});

describe('the limit cannot be dodged by changing address (finding 4)', () => {
  it('when 20 wrong passwords arrive at the same moment, then no more are checked than the limit allows', async () => {
    const user = await createUser(app.db, world.org.id, 'auditor');
    const answers = await Promise.all(
      Array.from({ length: 20 }, (_, i) => signIn(proxied, user.email, `guess-${i}`, `198.18.0.${i}`)),
    );
    const checked = answers.filter((r) => r.status === 401).length;
    expect(answers.filter((r) => r.status === 429)).toHaveLength(20 - checked);
    // Five before the limit; at most one more once the first 1 s delay has passed while the rest queued.
    expect(checked).toBeGreaterThanOrEqual(5);
    expect(checked).toBeLessThanOrEqual(6);
    const [row] = await app.db.query('SELECT failures FROM sign_in_failure WHERE bucket = ?', [
      `account:${user.email}`,
    ]);
    expect(Number(row.failures)).toBe(checked);
  });

  it(
    'when X-Forwarded-For changes on every try and no proxy is configured, ' +
      'then the header is ignored and the count holds',
    async () => {
      const user = await createUser(app.db, world.org.id, 'contractor');
      for (let i = 0; i < 5; i++) expect((await signIn(app, user.email, 'wrong', `10.9.${i}.1`)).status).toBe(401);
      const blocked = await signIn(app, user.email, TEST_PASSWORD, '10.9.99.1');
      expect(blocked.status).toBe(429);
      expect(blocked.body.error.code).toBe('rate_limited');
    },
  );

  it(
    'when wrong passwords come from many addresses through a trusted proxy, ' +
      'then the account cap is reached all the same, with a growing wait',
    async () => {
      const user = await createUser(app.db, world.org.id, 'manager');
      for (let i = 0; i < 5; i++) expect((await signIn(proxied, user.email, 'wrong', `192.0.2.${i}`)).status).toBe(401);
      const capped = await signIn(proxied, user.email, TEST_PASSWORD, '192.0.2.77');
      expect(capped.status).toBe(429);
      expect(capped.body.error.message).toMatch(/Too many failed sign-ins for this account\. Wait 1 second/);
      expect(capped.headers['retry-after']).toBe('1');
      await wait(1);
      expect((await signIn(proxied, user.email, 'wrong', '192.0.2.78')).status).toBe(401);
      expect((await signIn(proxied, user.email, 'wrong', '192.0.2.79')).headers['retry-after']).toBe('2');
      // Another account from the same addresses is not affected.
      expect((await signIn(proxied, world.users.admin.email, TEST_PASSWORD, '192.0.2.1')).status).toBe(200);
    },
  );

  it('when the configuration asks to trust every proxy hop, then the server refuses to start', async () => {
    await expect(createTestApp({ RILLMARK_TRUST_PROXY: 'true' })).rejects.toThrow(/RILLMARK_TRUST_PROXY/);
  });
});
