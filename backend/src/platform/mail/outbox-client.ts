import type { Config } from '../../config';
import type { OutboxMessage } from '@shared/mail/outbox-message';
import { AppError } from '../app-error';

/** Reads what the local fake SMTP server received (development outbox page). */
export async function fetchOutbox(mail: Config['mail']): Promise<OutboxMessage[]> {
  const url = `http://${mail.host}:${mail.fakeServerHttpPort}/messages`;
  let response: Response;
  try {
    response = await fetch(url, { signal: AbortSignal.timeout(3_000) });
  } catch {
    throw new AppError(
      'internal_error',
      `The local fake SMTP server is not answering at ${url}; start it with: bash ops/mail/start.sh`,
    );
  }
  if (!response.ok) throw new AppError('internal_error', `The fake SMTP server answered ${response.status}.`);
  const body = (await response.json()) as { messages: OutboxMessage[] };
  // Messages stored by an older fake server carry no organisations: they belong to nobody.
  return body.messages.map((m) => ({ ...m, organisationIds: m.organisationIds ?? [] }));
}
