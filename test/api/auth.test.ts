import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { startServer } from '../../backend/src/server';
import { testConfig } from '../support/test-env';
import {
  Client,
  createTestApp,
  createUser,
  createWorld,
  signedIn,
  TEST_PASSWORD,
  type TestApp,
  type World,
} from '../support/test-app';

let app: TestApp;
let world: World;

beforeAll(async () => {
  app = await createTestApp();
  world = await createWorld(app.db);
});
afterAll(async () => app?.stop());

describe('sign-in', () => {
  it('when the password is right, then the session is signed in and /me returns the user and role', async () => {
    const client = await signedIn(app, world.users.manager.email);
    const me = await client.get('/api/auth/me').expect(200);
    expect(me.body.email).toBe(world.users.manager.email);
    expect(me.body.organisation).toMatchObject({ organisationId: world.org.id, role: 'manager' });
    expect(me.body.capabilities).toMatchObject({ createSites: true, manageUsers: false });
  });

  it('when the password is wrong, then 401 with a plain message and no session', async () => {
    const client = new Client(app.server.url);
    const res = await client.signIn(world.users.auditor.email, 'wrong-password-123');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
    await client.get('/api/auth/me').expect(401);
  });

  it('when the e-mail is unknown, then the same 401 as a wrong password', async () => {
    const res = await new Client(app.server.url).signIn('nobody-here@test.example', TEST_PASSWORD);
    expect(res.status).toBe(401);
    expect(res.body.error.message).toBe('That e-mail and password do not match an active account.');
  });

  it('when the user is disabled, then sign-in is refused', async () => {
    const disabled = await createUser(app.db, world.org.id, 'manager', 'disabled');
    const res = await new Client(app.server.url).signIn(disabled.email);
    expect(res.status).toBe(401);
  });

  it('when the body has unknown fields or a malformed e-mail, then 400 naming the fields', async () => {
    const client = new Client(app.server.url);
    await client.fetchCsrf();
    const res = await client
      .post('/api/auth/sign-in', { email: 'not-an-email', password: 'x', remember: true })
      .expect(400);
    expect(res.body.error.details).toEqual(
      expect.arrayContaining([
        { field: 'email', message: 'must be an e-mail address' },
        { field: 'remember', message: 'is not a known field' },
      ]),
    );
  });

  it('when there are too many failed attempts for one e-mail, then 429 even with the right password', async () => {
    const user = await createUser(app.db, world.org.id, 'auditor');
    const client = new Client(app.server.url);
    // The test config allows 5 failed attempts per window.
    for (let i = 0; i < 5; i++) expect((await client.signIn(user.email, 'wrong-password-123')).status).toBe(401);
    const blocked = await client.signIn(user.email, TEST_PASSWORD);
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate_limited');
    // Another account from the same address is not blocked.
    expect((await new Client(app.server.url).signIn(world.users.contractor.email)).status).toBe(200);
  });

  it('when successful sign-ins repeat, then they do not count against the limit', async () => {
    for (let i = 0; i < 7; i++)
      expect((await new Client(app.server.url).signIn(world.users.admin.email)).status).toBe(200);
  });

  it('when signed out, then /me is 401 and the old session cookie no longer works', async () => {
    const client = await signedIn(app, world.users.contractor.email);
    await client.post('/api/auth/sign-out').expect(204);
    await client.get('/api/auth/me').expect(401);
    await client.get('/api/sites').expect(401);
  });
});

describe('CSRF', () => {
  it('when a state-changing request has no token, then 403 csrf_invalid and nothing changes', async () => {
    const client = await signedIn(app, world.users.manager.email);
    const res = await client.agent
      .post('/api/sites')
      .send({ name: 'Sneaky', kind: 'park', address: 'x', timeZone: 'UTC' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_invalid');
    const list = await client.get('/api/sites?q=Sneaky').expect(200);
    expect(list.body.total).toBe(0);
  });

  it('when the token belongs to another session, then 403', async () => {
    const a = await signedIn(app, world.users.manager.email);
    const b = await signedIn(app, world.users.admin.email);
    const tokenOfA = (await a.get('/api/auth/csrf')).body.token as string;
    const res = await b.agent.post('/api/auth/sign-out').set('x-xsrf-token', tokenOfA);
    expect(res.status).toBe(403);
  });
});

describe('sessions', () => {
  it('when the app restarts, then the session stored in MariaDB is still signed in', async () => {
    const first = await createTestApp();
    const client = await signedIn(first, world.users.manager.email);
    const cookie = (await client.get('/api/auth/me').expect(200)).request.cookies;
    await first.stop();

    const second = await createTestApp();
    try {
      const res = await fetch(`${second.server.url}/api/auth/me`, { headers: { cookie } });
      expect(res.status).toBe(200);
      expect(((await res.json()) as { email: string }).email).toBe(world.users.manager.email);
    } finally {
      await second.stop();
    }
  });
});

describe('health', () => {
  it('when the database answers, then status ok with database up', async () => {
    const res = await new Client(app.server.url).get('/api/health').expect(200);
    expect(res.body).toMatchObject({ status: 'ok', database: { status: 'up' } });
  });

  it(
    'when MariaDB cannot be reached at start, then the server says ' + 'so on each retry and finally fails plainly',
    async () => {
      const lines: string[] = [];
      const spy = vi.spyOn(process.stderr, 'write').mockImplementation((chunk) => (lines.push(String(chunk)), true));
      try {
        await expect(
          startServer(testConfig({ RILLMARK_DB_PORT: '1', RILLMARK_LOG_LEVEL: 'warn' }), { dbAttempts: 3 }),
        ).rejects.toThrow(
          /Cannot reach MariaDB at 127\.0\.0\.1:1\/\w+ after 3 attempts .*Is it running\? Start it with: npm run db:start/,
        );
      } finally {
        spy.mockRestore();
      }
      expect(
        lines.filter((l) => /MariaDB at 127\.0\.0\.1:1\/\w+ is not reachable .* retry \d\/2/.test(l)),
      ).toHaveLength(2);
    },
  );
});
