import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, createTestApp, createWorld, signedIn, suffix, type TestApp, type World } from '../support/test-app';

let app: TestApp;
let world: World;
let admin: Client;

interface Mail {
  to: string;
  subject: string;
  text: string;
  html: string | null;
}

/** Reads the local fake SMTP server's message list, as the development outbox page does. */
async function mailTo(address: string): Promise<Mail> {
  for (let i = 0; i < 40; i++) {
    const res = await fetch(`http://${app.config.mail.host}:${app.config.mail.fakeServerHttpPort}/messages`);
    const found = ((await res.json()) as { messages: Mail[] }).messages.find((m) => m.to.includes(address));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${address}`);
}

const linkToken = (mail: Mail) => /token=([A-Za-z0-9_-]+)/.exec(mail.text)![1]!;

beforeAll(async () => {
  app = await createTestApp();
  world = await createWorld(app.db);
  admin = await signedIn(app, world.users.admin.email);
});
afterAll(async () => app?.stop());

describe('inviting users', () => {
  it(
    'when an admin invites someone, then an e-mail with a one-time ' +
      'link arrives and accepting it signs them in with that role',
    async () => {
      const email = `new-${suffix()}@test.example`;
      const invited = await admin
        .post('/api/users/invitations', { email, displayName: 'Rowan Test', role: 'contractor' })
        .expect(201);
      expect(invited.body).toMatchObject({ email, role: 'contractor', status: 'invited' });

      const mail = await mailTo(email);
      expect(mail.subject).toMatch(/Invitation to .* on Rillmark/);
      expect(mail.html).toContain('Choose a password');
      const token = linkToken(mail);

      const visitor = new Client(app.server.url);
      expect((await visitor.get(`/api/auth/tokens/${token}`).expect(200)).body).toEqual({
        email,
        displayName: 'Rowan Test',
        purpose: 'invite',
      });
      await visitor.fetchCsrf();
      await visitor.post('/api/auth/accept-invite', { token, password: 'short' }).expect(400);
      const accepted = await visitor
        .post('/api/auth/accept-invite', { token, password: 'a-long-enough-secret' })
        .expect(200);
      expect(accepted.body.organisation).toMatchObject({ organisationId: world.org.id, role: 'contractor' });

      // The link works once.
      await visitor.get(`/api/auth/tokens/${token}`).expect(404);
      await new Client(app.server.url).signIn(email, 'a-long-enough-secret').then((r) => expect(r.status).toBe(200));
      const listed = await admin.get(`/api/users?q=${encodeURIComponent(email)}`).expect(200);
      expect(listed.body.items[0]).toMatchObject({ email, status: 'active', role: 'contractor' });
    },
  );

  it('when the invitee is already a member, then 409 on email', async () => {
    const res = await admin
      .post('/api/users/invitations', { email: world.users.manager.email, displayName: 'Dup', role: 'manager' })
      .expect(409);
    expect(res.body.error.details).toEqual([{ field: 'email', message: 'is already a member' }]);
  });

  it('when the role is not one of ours, then 400 naming role', async () => {
    const res = await admin
      .post('/api/users/invitations', { email: `r-${suffix()}@test.example`, displayName: 'R', role: 'superuser' })
      .expect(400);
    expect(res.body.error.details[0].field).toBe('role');
  });
});

describe('password reset and account changes', () => {
  it('when an admin sends a reset, then the link sets a new password and the old one stops working', async () => {
    const world2 = await createWorld(app.db);
    const admin2 = await signedIn(app, world2.users.admin.email);
    await admin2.post(`/api/users/${world2.users.auditor.id}/password-reset`).expect(202);
    const token = linkToken(await mailTo(world2.users.auditor.email));
    const visitor = new Client(app.server.url);
    await visitor.fetchCsrf();
    await visitor.post('/api/auth/reset-password', { token, password: 'brand-new-password-1' }).expect(204);
    expect((await new Client(app.server.url).signIn(world2.users.auditor.email)).status).toBe(401);
    expect((await new Client(app.server.url).signIn(world2.users.auditor.email, 'brand-new-password-1')).status).toBe(
      200,
    );
    await visitor.post('/api/auth/reset-password', { token, password: 'another-password-2' }).expect(404);
  });

  it('when a role changes or a user is disabled, then it takes effect on their next request', async () => {
    const world3 = await createWorld(app.db);
    const admin3 = await signedIn(app, world3.users.admin.email);
    const manager = await signedIn(app, world3.users.manager.email);
    await manager
      .post('/api/sites', { name: `M ${suffix()}`, kind: 'park', address: 'a', timeZone: 'UTC' })
      .expect(201);
    await admin3.patch(`/api/users/${world3.users.manager.id}`, { role: 'auditor' }).expect(200);
    await manager
      .post('/api/sites', { name: `M ${suffix()}`, kind: 'park', address: 'a', timeZone: 'UTC' })
      .expect(403);
    await admin3.patch(`/api/users/${world3.users.manager.id}`, { status: 'disabled' }).expect(200);
    await manager.get('/api/sites').expect(401);
  });

  it('when the last active admin would lose the role, then 409 and nothing changes', async () => {
    const world4 = await createWorld(app.db);
    const admin4 = await signedIn(app, world4.users.admin.email);
    const res = await admin4.patch(`/api/users/${world4.users.admin.id}`, { role: 'manager' }).expect(409);
    expect(res.body.error.message).toBe('The organisation must keep at least one active administrator.');
    expect((await admin4.get('/api/auth/me').expect(200)).body.organisation.role).toBe('admin');
  });

  it('when an admin opens the development outbox, then the sent messages are listed; others get 403', async () => {
    const box = await admin.get('/api/dev/outbox').expect(200);
    expect(box.body.messages.length).toBeGreaterThan(0);
    expect(box.body.messages[0]).toHaveProperty('subject');
    await (await signedIn(app, world.users.manager.email)).get('/api/dev/outbox').expect(403);
  });
});

describe('the development outbox and other organisations (finding 2)', () => {
  it(
    "when another organisation's administrator opens the outbox, " +
      "then they never see this organisation's invitation or reset mail",
    async () => {
      const stranger = await createWorld(app.db);
      const strangerAdmin = await signedIn(app, stranger.users.admin.email);
      const email = `secret-${suffix()}@test.example`;
      await admin.post('/api/users/invitations', { email, displayName: 'Kept Private', role: 'manager' }).expect(201);
      await admin.post(`/api/users/${world.users.auditor.id}/password-reset`).expect(202);
      await mailTo(email);
      // Mail goes out in the background: wait until both messages have reached the fake SMTP server.
      const mine = (box: Mail[]) =>
        box.some((m) => m.to.includes(email)) && box.some((m) => m.to.includes(world.users.auditor.email));
      let ownBox: Mail[] = [];
      for (let i = 0; i < 40 && !mine(ownBox); i++) {
        if (i) await new Promise((r) => setTimeout(r, 100));
        ownBox = (await admin.get('/api/dev/outbox').expect(200)).body.messages as Mail[];
      }
      expect(mine(ownBox)).toBe(true);

      const theirBox = (await strangerAdmin.get('/api/dev/outbox').expect(200)).body.messages as Mail[];
      expect(theirBox.filter((m) => m.to.includes(email) || m.to.includes(world.users.auditor.email))).toEqual([]);
      // So the invitation cannot be taken over from the other organisation.
      expect(JSON.stringify(theirBox)).not.toContain(linkToken(await mailTo(email)));
    },
  );

  it('when the outbox is not switched on explicitly, then it does not exist', async () => {
    const plain = await createTestApp({ RILLMARK_DEV_OUTBOX: undefined });
    try {
      const client = await signedIn(plain, world.users.admin.email);
      await client.get('/api/dev/outbox').expect(404);
    } finally {
      await plain.stop();
    }
  });
});
