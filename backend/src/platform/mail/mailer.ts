import nodemailer, { type Transporter } from 'nodemailer';
import type { Config } from '../../config';
import { logger } from '../logger';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** A stable Message-ID, so a message sent twice after a crash is recognisably the same one. */
  messageId?: string;
  /**
   * The organisations the message was sent for (whose action caused it, whose users it is addressed to as members).
   * The development outbox shows an administrator only their own organisation's messages.
   */
  organisationIds?: number[];
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** The header the development outbox reads (added only while the outbox is on, never in production). */
export const ORGANISATIONS_HEADER = 'X-Rillmark-Organisations';

/**
 * Sends through SMTP with a pooled nodemailer transport (a few connections reused across messages). In development
 * and tests the SMTP server is the project's local fake. Deadlines keep one message from holding a delivery pass:
 * 5 s to connect and greet, 30 s of socket silence.
 */
export function createSmtpMailer(mail: Config['mail']): Mailer {
  const transport: Transporter = nodemailer.createTransport({
    pool: true,
    maxConnections: 2,
    maxMessages: 100,
    host: mail.host,
    port: mail.port,
    secure: mail.tls === 'implicit',
    requireTLS: mail.tls === 'starttls',
    ignoreTLS: mail.tls === 'none',
    auth: mail.auth ? { user: mail.auth.user, pass: mail.auth.password } : undefined,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 30_000,
  });
  return {
    async send(message) {
      const { organisationIds, ...rest } = message;
      const headers =
        mail.devOutbox && organisationIds?.length ? { [ORGANISATIONS_HEADER]: organisationIds.join(',') } : undefined;
      const info = await transport.sendMail({ from: mail.from, ...rest, headers });
      logger.info('mail sent', { to: message.to, subject: message.subject, messageId: info.messageId });
    },
    close: () => transport.close(),
  };
}
