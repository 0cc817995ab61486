import type { DataSource } from 'typeorm';
import type { MailQueue } from '../../mail/domain/mail-queue';
import type { AlertRepairsRepository } from '../data/alert-repairs-repository';

/** Tells the person who resolved an alert as fixed that the data did not confirm the repair (the alert is open). */
export class RepairNotifier {
  constructor(
    private readonly db: DataSource,
    private readonly repairs: AlertRepairsRepository,
    private readonly mailQueue: MailQueue,
    private readonly baseUrl: string,
  ) {}

  /** Returns how many messages were queued; the dedupe key sends one per alert and verdict. */
  async notConfirmed(alerts: { alertId: number; at: number }[]): Promise<number> {
    if (alerts.length === 0) return 0;
    const at = new Map(alerts.map((a) => [a.alertId, a.at]));
    const people = await this.repairs.resolvers([...at.keys()]);
    let queued = 0;
    await this.db.transaction(async (em) => {
      for (const p of people) {
        const link = `${this.baseUrl}/alerts/${p.alertId}`;
        const text = [
          `Hello ${p.name},`,
          '',
          `You resolved an alert at ${p.siteName} as fixed. The meter data since the repair does not confirm it, so ` +
            'the alert is open again.',
          '',
          `See the nights after the repair: ${link}`,
        ].join('\n');
        const mail = { to: p.email, subject: `Repair not confirmed by data: ${p.siteName}`, text };
        const key = `repair-not-confirmed:${p.alertId}:${p.userId}:${at.get(p.alertId)}`;
        if (await this.mailQueue.enqueue(em, mail, key)) queued++;
      }
    });
    if (queued > 0) this.mailQueue.kick();
    return queued;
  }
}
