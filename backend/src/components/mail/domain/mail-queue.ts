import { randomBytes } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import type { Mailer, OutgoingMail } from '../../../platform/mail/mailer';
import { logger } from '../../../platform/logger';
import { INSTANCE_ID } from '../../../jobs/job-lease';
import { MailMessageEntity } from '../data/mail-message.entity';

/** Minutes to wait after the n-th failed attempt; after the last one the message is marked failed. */
const BACKOFF_MINUTES = [1, 2, 5, 10, 30, 60, 120, 240];
const CLAIM_MS = 2 * 60_000;

export interface DeliveryReport {
  sent: number;
  failed: number;
  retrying: number;
}

/**
 * Outgoing mail kept in MariaDB: enqueued inside the transaction of the change that causes it (so a
 * rolled-back change sends nothing), delivered by whichever instance claims it, retried with back-off
 * while SMTP is down. A sent message is never claimed again. If a process dies between the SMTP server
 * accepting a message and the row being marked sent, the claim expires and the message is sent again
 * with the same Message-ID, which lets receiving servers and clients drop the copy.
 */
export class MailQueue {
  private delivering: Promise<DeliveryReport> | null = null;

  constructor(
    private readonly db: DataSource,
    private readonly mailer: Mailer,
  ) {}

  /** Queues a message; a second message with the same dedupe key is ignored. Returns false for a duplicate. */
  async enqueue(em: EntityManager, mail: OutgoingMail, dedupeKey: string): Promise<boolean> {
    const result: { affectedRows: number } = await em.query(
      `INSERT IGNORE INTO mail_message (dedupe_key, to_address, subject, body_text, body_html,
        status, attempts, next_attempt_at)
       VALUES (?, ?, ?, ?, ?, 'queued', 0, ?)`,
      [dedupeKey, mail.to, mail.subject, mail.text, mail.html ?? null, new Date()],
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
    const now = new Date();
    // Unique per pass, so two passes can never both believe they own a row.
    const claim = `${INSTANCE_ID}:${randomBytes(4).toString('hex')}`;
    await this.db.query(
      `UPDATE mail_message SET status = 'sending', claimed_by = ?, claimed_until = ?
       WHERE (status = 'queued' AND next_attempt_at <= ?) OR (status = 'sending' AND claimed_until < ?)
       ORDER BY id LIMIT ?`,
      [claim, new Date(now.getTime() + CLAIM_MS), now, now, limit],
    );
    const repo = this.db.getRepository(MailMessageEntity);
    const claimed = await repo.find({ where: { claimedBy: claim, status: 'sending' }, order: { id: 'ASC' } });
    const report: DeliveryReport = { sent: 0, failed: 0, retrying: 0 };
    for (const m of claimed) {
      try {
        await this.mailer.send({
          to: m.to,
          subject: m.subject,
          text: m.text,
          html: m.html ?? undefined,
          messageId: `<mail-${m.id}@rillmark.invalid>`,
        });
        await repo.update(
          { id: m.id, claimedBy: claim },
          { status: 'sent', sentAt: new Date(), attempts: m.attempts + 1, lastError: null },
        );
        report.sent++;
      } catch (err) {
        const attempts = m.attempts + 1;
        const giveUp = attempts > BACKOFF_MINUTES.length;
        const wait = BACKOFF_MINUTES[Math.min(attempts, BACKOFF_MINUTES.length) - 1]! * 60_000;
        await repo.update(
          { id: m.id, claimedBy: claim },
          {
            status: giveUp ? 'failed' : 'queued',
            attempts,
            nextAttemptAt: new Date(Date.now() + wait),
            lastError: String((err as Error).message).slice(0, 500),
            claimedBy: null,
            claimedUntil: null,
          },
        );
        if (giveUp) report.failed++;
        else report.retrying++;
        logger.warn('mail not delivered; will retry', { id: m.id, to: m.to, attempts, error: (err as Error).message });
      }
    }
    return report;
  }
}
