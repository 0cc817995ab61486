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
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** Sends through SMTP with nodemailer. In development and tests the SMTP server is the project's local fake. */
export function createSmtpMailer(mail: Config['mail']): Mailer {
  const transport: Transporter = nodemailer.createTransport({
    host: mail.host,
    port: mail.port,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 5_000,
  });
  return {
    async send(message) {
      const info = await transport.sendMail({ from: mail.from, ...message });
      logger.info('mail sent', { to: message.to, subject: message.subject, messageId: info.messageId });
    },
    close: () => transport.close(),
  };
}
