/** One e-mail caught by the local fake SMTP server, as the development outbox lists it. */
export interface OutboxMessage {
  id: string;
  from: string;
  to: string;
  subject: string;
  date: string;
  text: string;
  html: string | null;
  /** Organisations the message was sent for (from its X-Rillmark-Organisations header); empty when untagged. */
  organisationIds: number[];
}
