/**
 * Rillmark's local stand-in for a hosted mail service: a real SMTP server (smtp-server) on loopback that
 * accepts every message, parses it (mailparser), keeps it in a JSON-lines file and lists it over HTTP
 * for the development outbox page and the tests. Nothing is delivered anywhere.
 *
 *   GET    /messages   newest first
 *   DELETE /messages   forget everything
 *
 * Recipients at `@rejects.invalid` are refused with a permanent 550, so tests can see what a real server's
 * "no such mailbox" does to the queue.
 */
import { appendFileSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:http';
import { dirname } from 'node:path';
import { randomUUID } from 'node:crypto';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { OutboxMessage } from '../../shared/mail/outbox-message';

export interface FakeSmtpOptions {
  host: string;
  smtpPort: number;
  httpPort: number;
  file: string;
  /** Accept at most this many messages, then refuse with 421 (tests use it to simulate an outage). */
  refuseAfter?: number;
}

export async function startFakeSmtp(options: FakeSmtpOptions) {
  mkdirSync(dirname(options.file), { recursive: true });
  const messages: OutboxMessage[] = existsSync(options.file)
    ? readFileSync(options.file, 'utf8')
        .split('\n')
        .filter(Boolean)
        .map((l) => JSON.parse(l) as OutboxMessage)
    : [];

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Rillmark fake SMTP (development only)',
    logger: false,
    onRcptTo(address, _session, callback) {
      if (address.address.toLowerCase().endsWith('@rejects.invalid')) {
        const refused = Object.assign(new Error('No such mailbox here'), { responseCode: 550 });
        return callback(refused);
      }
      callback();
    },
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((mail) => {
          const to = Array.isArray(mail.to) ? mail.to.map((a) => a.text).join(', ') : (mail.to?.text ?? '');
          const message: OutboxMessage = {
            id: randomUUID(),
            from: mail.from?.text ?? '',
            to,
            subject: mail.subject ?? '',
            date: (mail.date ?? new Date()).toISOString(),
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
            organisationIds: String(mail.headers.get('x-rillmark-organisations') ?? '')
              .split(',')
              .filter((id) => /^\d+$/.test(id.trim()))
              .map(Number),
          };
          messages.push(message);
          appendFileSync(options.file, JSON.stringify(message) + '\n');
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(options.smtpPort, options.host, () => resolve());
  });

  const http = createServer((req, res) => {
    if (req.url?.startsWith('/messages') && req.method === 'GET') {
      res.writeHead(200, { 'content-type': 'application/json' });
      res.end(JSON.stringify({ messages: [...messages].reverse() }));
    } else if (req.url?.startsWith('/messages') && req.method === 'DELETE') {
      messages.length = 0;
      writeFileSync(options.file, '');
      res.writeHead(204).end();
    } else {
      res.writeHead(404).end();
    }
  });
  await new Promise<void>((resolve, reject) => {
    http.once('error', reject);
    http.listen(options.httpPort, options.host, () => resolve());
  });

  return {
    messages,
    async stop() {
      await new Promise<void>((r) => smtp.close(() => r()));
      await new Promise<void>((r) => http.close(() => r()));
    },
  };
}

// Run directly: `node --import tsx ops/mail/fake-smtp-server.ts`
if (import.meta.url === `file://${process.argv[1]}`) {
  const env = process.env;
  const host = env['RILLMARK_SMTP_HOST'] ?? '127.0.0.1';
  const smtpPort = Number(env['RILLMARK_SMTP_PORT'] ?? 2526);
  const httpPort = Number(env['RILLMARK_FAKE_SMTP_HTTP_PORT'] ?? 2580);
  const file = env['RILLMARK_FAKE_SMTP_FILE'] ?? '.data/mail/messages.jsonl';
  const server = await startFakeSmtp({ host, smtpPort, httpPort, file });
  console.log(`fake SMTP on ${host}:${smtpPort}, message list on http://${host}:${httpPort}/messages`);
  const stop = () => server.stop().then(() => process.exit(0));
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}
