/** One e-mail caught by the local fake SMTP server, as the development outbox lists it. */
export interface OutboxMessage {
  id: string;
  from: string;
  to: string;
  subject: string;
  date: string;
  text: string;
  html: string | null;
}
