import type { DataSource } from 'typeorm';
import type { Config } from '../../config';
import type { Mailer } from '../../platform/mail/mailer';
import { MailQueue } from './domain/mail-queue';

export interface Mail {
  queue: MailQueue;
}

/** Wires the outgoing-mail queue (no routes: the development outbox is the outbox component). */
export function createMail(deps: { db: DataSource; mailer: Mailer; config: Config }): Mail {
  return { queue: new MailQueue(deps.db, deps.mailer, { retryBaseMs: deps.config.mail.retryBaseMs }) };
}
