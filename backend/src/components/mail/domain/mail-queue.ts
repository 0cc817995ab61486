import { randomBytes } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import type { Mailer, OutgoingMail } from '../../../platform/mail/mailer';
import { logger } from '../../../platform/logger';
import { INSTANCE_ID } from '../../../jobs/job-lease';
import { MailMessageEntity } from '../data/mail-message.entity';

/** Waits after the n-th failed attempt, in units of the retry base (1 minute by default); then the message fails. */
const BACKOFF_STEPS = [1, 2, 5, 10, 30, 60, 120, 240];

export interface DeliveryReport {
  sent: number;
  failed: number;
  retrying: number;
}

export interface MailQueueOptions {
  /** How long a claim on one message lasts; renewed every third of it while that message is being sent. */
  claimMs?: number;
  /** The first retry's wait (RILLMARK_MAIL_RETRY_SECONDS); later ones are multiples of it. */
  retryBaseMs?: number;
}

/** SMTP answered with a permanent failure (5xx: unknown recipient, refused sender…): sending again cannot help. */
function permanentFailure(err: unknown): boolean {
  const code = (err as { responseCode?: number }).responseCode;
  return typeof code === 'number' && code >= 500 && code < 600;
}

/**
 * Outgoing mail kept in MariaDB: enqueued inside the transaction of the change that causes it (so a rolled-back
 * change sends nothing), delivered by whichever instance claims it, retried with back-off while SMTP is down
 * (temporary failures only: a 5xx answer fails the message at once).
 *
 * Sent once across instances: each message is claimed on its own and its claim is renewed while it is being sent,
 * so a slow send never lets the claim lapse and another instance take the same message. Only if the process dies
 * between the SMTP server accepting a message and the row being marked sent does the claim expire and the message
 * go again, with the same Message-ID, which lets receiving servers and clients drop the copy.
 */
export class MailQueue {
  private delivering: Promise<DeliveryReport> | null = null;
  private readonly claimMs: number;
  private readonly retryBaseMs: number;

  constructor(
    private readonly db: DataSource,
    private readonly mailer: Mailer,
    options: MailQueueOptions = {},
  ) {
    this.claimMs = options.claimMs ?? 2 * 60_000;
    this.retryBaseMs = options.retryBaseMs ?? 60_000;
  }

  /** Queues a message; a second message with the same dedupe key is ignored. Returns false for a duplicate. */
  async enqueue(em: EntityManager, mail: OutgoingMail, dedupeKey: string): Promise<boolean> {
    const result: { affectedRows: number } = await em.query(
      `INSERT IGNORE INTO mail_message (dedupe_key, to_address, subject, body_text, body_html, organisation_ids,
        status, attempts, next_attempt_at)
       VALUES (?, ?, ?, ?, ?, ?, 'queued', 0, ?)`,
      [
        dedupeKey,
        mail.to,
        mail.subject,
        mail.text,
        mail.html ?? null,
        mail.organisationIds?.length ? [...new Set(mail.organisationIds)].join(',') : null,
        new Date(),
      ],
    );
    return result.affectedRows === 1;
  }

  /** Starts a delivery pass now (after a commit) without waiting for it; errors are logged, not thrown. */
  kick(): void {
    void this.deliverDue().catch((err: Error) => logger.error('mail delivery pass failed', { error: err.message }));
  }

  /** Delivers what is due; one pass at a time per process (claims keep instances apart). */
  deliverDue(limit = 50): Promise<DeliveryReport> {
    this.delivering ??= this.deliverPass(limit).finally(() => (this.delivering = null));
    return this.delivering;
  }

  private async deliverPass(limit: number): Promise<DeliveryReport> {
    const report: DeliveryReport = { sent: 0, failed: 0, retrying: 0 };
    for (let i = 0; i < limit; i++) {
      const claimed = await this.claimNext();
      if (!claimed) break;
      await this.deliver(claimed.message, claimed.claim, report);
    }
    return report;
  }

  /** Claims the oldest due message (or one whose claim lapsed) for this pass; null when none is due. */
  private async claimNext(): Promise<{ message: MailMessageEntity; claim: string } | null> {
    const now = new Date();
    // Unique per message and pass, so two passes can never both believe they own a row.
    const claim = `${INSTANCE_ID}:${randomBytes(4).toString('hex')}`;
    const result: { affectedRows: number } = await this.db.query(
      `UPDATE mail_message SET status = 'sending', claimed_by = ?, claimed_until = ?
       WHERE (status = 'queued' AND next_attempt_at <= ?) OR (status = 'sending' AND claimed_until < ?)
       ORDER BY id LIMIT 1`,
      [claim, new Date(now.getTime() + this.claimMs), now, now],
    );
    if (result.affectedRows === 0) return null;
    const message = await this.db.getRepository(MailMessageEntity).findOneBy({ claimedBy: claim, status: 'sending' });
    return message ? { message, claim } : null;
  }

  private async deliver(m: MailMessageEntity, claim: string, report: DeliveryReport): Promise<void> {
    const repo = this.db.getRepository(MailMessageEntity);
    const heartbeat = setInterval(() => void this.renew(m.id, claim), Math.max(200, this.claimMs / 3));
    let error: unknown = null;
    try {
      await this.mailer.send({
        to: m.to,
        subject: m.subject,
        text: m.text,
        html: m.html ?? undefined,
        messageId: `<mail-${m.id}@rillmark.invalid>`,
        organisationIds: m.organisationIds ? m.organisationIds.split(',').map(Number) : undefined,
      });
    } catch (err) {
      error = err;
    } finally {
      clearInterval(heartbeat);
    }
    const attempts = m.attempts + 1;
    if (error === null) {
      await repo.update(
        { id: m.id, claimedBy: claim },
        { status: 'sent', sentAt: new Date(), attempts, lastError: null },
      );
      report.sent++;
      return;
    }
    const message = (error as Error).message;
    const giveUp = permanentFailure(error) || attempts > BACKOFF_STEPS.length;
    const wait = BACKOFF_STEPS[Math.min(attempts, BACKOFF_STEPS.length) - 1]! * this.retryBaseMs;
    await repo.update(
      { id: m.id, claimedBy: claim },
      {
        status: giveUp ? 'failed' : 'queued',
        attempts,
        nextAttemptAt: new Date(Date.now() + wait),
        lastError: String(message).slice(0, 500),
        claimedBy: null,
        claimedUntil: null,
      },
    );
    if (giveUp) {
      report.failed++;
      logger.warn('mail not delivered; not retried', { id: m.id, to: m.to, attempts, error: message });
    } else {
      report.retrying++;
      logger.warn('mail not delivered; will retry', { id: m.id, to: m.to, attempts, error: message });
    }
  }

  /** Keeps the claim on a message being sent; a claim found gone means another instance took it (logged). */
  private async renew(id: number, claim: string): Promise<void> {
    try {
      const result: { affectedRows: number } = await this.db.query(
        `UPDATE mail_message SET claimed_until = ? WHERE id = ? AND claimed_by = ? AND status = 'sending'`,
        [new Date(Date.now() + this.claimMs), id, claim],
      );
      if (result.affectedRows === 0) logger.warn('mail claim lost while sending', { id });
    } catch (err) {
      logger.warn('mail claim not renewed', { id, error: (err as Error).message });
    }
  }
}
