import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MailQueue } from '../../backend/src/components/mail/domain/mail-queue';
import { MailMessageEntity } from '../../backend/src/components/mail/data/mail-message.entity';
import { JobLease } from '../../backend/src/jobs/job-lease';
import { createSmtpMailer } from '../../backend/src/platform/mail/mailer';
import { createTestApp, createWorld, signedIn, suffix, type TestApp } from '../support/test-app';
import { testConfig } from '../support/test-env';

let app: TestApp;

/** How many messages with this subject the local fake SMTP server has received. */
async function received(subject: string): Promise<number> {
  const res = await fetch(`http://${app.config.mail.host}:${app.config.mail.fakeServerHttpPort}/messages`);
  return ((await res.json()) as { messages: { subject: string }[] }).messages.filter((m) => m.subject === subject)
    .length;
}

beforeAll(async () => {
  app = await createTestApp();
});
afterAll(async () => app?.stop());

describe('mail queue', () => {
  it(
    'when SMTP is down, then the message waits in MariaDB, is retried, ' + 'and arrives exactly once when SMTP is back',
    async () => {
      const subject = `Queued ${suffix()}`;
      const down = createSmtpMailer({ ...testConfig().mail, port: 1 });
      const up = createSmtpMailer(testConfig().mail);
      const queueDown = new MailQueue(app.db, down);
      const queueUp = new MailQueue(app.db, up);
      try {
        await app.db.transaction((em) =>
          queueDown.enqueue(em, { to: 'ops@test.example', subject, text: 'hello' }, `test:${subject}`),
        );
        const first = await queueDown.deliverDue();
        expect(first.retrying).toBeGreaterThanOrEqual(1);
        const row = await app.db.getRepository(MailMessageEntity).findOneByOrFail({ dedupeKey: `test:${subject}` });
        expect(row).toMatchObject({ status: 'queued', attempts: 1 });
        expect(row.lastError).toBeTruthy();
        expect(await received(subject)).toBe(0);

        // Not due yet (back-off): nothing is sent; make it due, as time passing would.
        await queueUp.deliverDue();
        expect(await received(subject)).toBe(0);
        await app.db
          .getRepository(MailMessageEntity)
          .update({ id: row.id }, { nextAttemptAt: new Date(Date.now() - 1000) });
        await queueUp.deliverDue();
        await queueUp.deliverDue();
        expect(await received(subject)).toBe(1);
        expect(await app.db.getRepository(MailMessageEntity).findOneByOrFail({ id: row.id })).toMatchObject({
          status: 'sent',
          attempts: 2,
        });
      } finally {
        down.close();
        up.close();
      }
    },
  );

  it('when the same message is queued twice with one key, then it is stored and sent once', async () => {
    const subject = `Once ${suffix()}`;
    const mailer = createSmtpMailer(testConfig().mail);
    const queue = new MailQueue(app.db, mailer);
    try {
      const firstTime = await app.db.transaction((em) =>
        queue.enqueue(em, { to: 'a@test.example', subject, text: 'x' }, `k:${subject}`),
      );
      const secondTime = await app.db.transaction((em) =>
        queue.enqueue(em, { to: 'a@test.example', subject, text: 'x' }, `k:${subject}`),
      );
      expect([firstTime, secondTime]).toEqual([true, false]);
      await Promise.all([queue.deliverDue(), new MailQueue(app.db, mailer).deliverDue()]);
      expect(await received(subject)).toBe(1);
    } finally {
      mailer.close();
    }
  });

  it('when the change that queued a message rolls back, then nothing is sent', async () => {
    const subject = `Rolled back ${suffix()}`;
    const mailer = createSmtpMailer(testConfig().mail);
    const queue = new MailQueue(app.db, mailer);
    try {
      await expect(
        app.db.transaction(async (em) => {
          await queue.enqueue(em, { to: 'a@test.example', subject, text: 'x' }, `rb:${subject}`);
          throw new Error('the change failed');
        }),
      ).rejects.toThrow('the change failed');
      await queue.deliverDue();
      expect(await received(subject)).toBe(0);
      expect(await app.db.getRepository(MailMessageEntity).countBy({ dedupeKey: `rb:${subject}` })).toBe(0);
    } finally {
      mailer.close();
    }
  });

  it(
    'when SMTP refuses the recipient for good (550), ' + 'then the message fails at once and is never retried',
    async () => {
      const subject = `Refused ${suffix()}`;
      const mailer = createSmtpMailer(testConfig().mail);
      const queue = new MailQueue(app.db, mailer);
      try {
        await app.db.transaction((em) =>
          queue.enqueue(em, { to: 'nobody@rejects.invalid', subject, text: 'x' }, `550:${subject}`),
        );
        await queue.deliverDue();
        const row = await app.db.getRepository(MailMessageEntity).findOneByOrFail({ dedupeKey: `550:${subject}` });
        expect(row).toMatchObject({ status: 'failed', attempts: 1 });
        expect(row.lastError).toMatch(/550/);
      } finally {
        mailer.close();
      }
    },
  );

  it(
    'when one message takes longer to send than its claim lasts, ' +
      'then the claim is renewed and no other instance sends it again',
    async () => {
      const subject = `Slow ${suffix()}`;
      const mailer = createSmtpMailer(testConfig().mail);
      // SMTP taking 1.5 s for this message, against a 0.6 s claim: without renewal the claim lapses mid-send.
      const slow = {
        send: async (m: Parameters<typeof mailer.send>[0]) => {
          if (m.subject === subject) await new Promise((r) => setTimeout(r, 1_500));
          await mailer.send(m);
        },
        close: () => undefined,
      };
      const instanceA = new MailQueue(app.db, slow, { claimMs: 600 });
      const instanceB = new MailQueue(app.db, mailer, { claimMs: 600 });
      try {
        await app.db.transaction((em) =>
          instanceA.enqueue(em, { to: 'slow@test.example', subject, text: 'x' }, `slow:${subject}`),
        );
        const passA = instanceA.deliverDue();
        await new Promise((r) => setTimeout(r, 1_000));
        await instanceB.deliverDue();
        await passA;
        expect(await received(subject)).toBe(1);
        expect(
          await app.db.getRepository(MailMessageEntity).findOneByOrFail({ dedupeKey: `slow:${subject}` }),
        ).toMatchObject({ status: 'sent', attempts: 1 });
      } finally {
        mailer.close();
      }
    },
  );

  it(
    'when an admin invites someone while SMTP is down, then the invitation ' +
      'is still created and its mail is queued',
    async () => {
      const world = await createWorld(app.db);
      const broken = await createTestApp({ RILLMARK_SMTP_PORT: '1' });
      try {
        const admin = await signedIn(broken, world.users.admin.email);
        const email = `late-${suffix()}@test.example`;
        await admin.post('/api/users/invitations', { email, displayName: 'Late Mail', role: 'manager' }).expect(201);
        await new Promise((r) => setTimeout(r, 300));
        const queued = await app.db.getRepository(MailMessageEntity).findOneByOrFail({ to: email });
        expect(queued.status).toBe('queued');
      } finally {
        await broken.stop();
      }
    },
  );
});

describe('job lease', () => {
  it('when two instances want the same job, then only one holds it until it is released or expires', async () => {
    const name = `job-${suffix()}`;
    const a = new JobLease(app.db, name, 'instance-a');
    const b = new JobLease(app.db, name, 'instance-b');
    expect(await a.tryAcquire(60_000)).toBe(true);
    expect(await b.tryAcquire(60_000)).toBe(false);
    expect(await a.tryAcquire(60_000)).toBe(true); // renewal by the holder
    await a.release();
    expect(await b.tryAcquire(200)).toBe(true);
    await new Promise((r) => setTimeout(r, 400));
    expect(await a.tryAcquire(60_000)).toBe(true); // b's lease expired
  });

  it('when runExclusive is called on two instances at once, then the work runs once', async () => {
    const name = `job-${suffix()}`;
    let runs = 0;
    const work = async () => {
      runs++;
      await new Promise((r) => setTimeout(r, 200));
      return 'done';
    };
    const results = await Promise.all([
      new JobLease(app.db, name, 'x').runExclusive(10_000, work),
      new JobLease(app.db, name, 'y').runExclusive(10_000, work),
    ]);
    expect(runs).toBe(1);
    expect(results.filter((r) => r === 'done')).toHaveLength(1);
    expect(results.filter((r) => r === null)).toHaveLength(1);
  });
});
