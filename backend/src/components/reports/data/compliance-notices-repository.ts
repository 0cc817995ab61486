import type { DataSource, EntityManager } from 'typeorm';
import { ComplianceNoticeEntity } from './compliance-notice.entity';

export interface NoticeRecipient {
  userId: number;
  email: string;
  displayName: string;
}

/** Compliance notices and who receives them. */
export class ComplianceNoticesRepository {
  constructor(private readonly db: DataSource) {}

  /** When each site was last sent a notice for `month`, or for any month of `year` when month is null. */
  async latest(siteIds: number[], month: string | null, year: number): Promise<Map<number, Date>> {
    if (!siteIds.length) return new Map();
    const rows: { siteId: number; sentAt: Date }[] = await this.db.query(
      `SELECT site_id AS siteId, MAX(sent_at) AS sentAt FROM compliance_notice
       WHERE site_id IN (?) AND ${month ? 'month = ?' : 'month LIKE ?'} GROUP BY site_id`,
      [siteIds, month ?? `${year}-%`],
    );
    return new Map(rows.map((r) => [Number(r.siteId), new Date(r.sentAt)]));
  }

  find(siteId: number, month: string): Promise<ComplianceNoticeEntity | null> {
    return this.db.getRepository(ComplianceNoticeEntity).findOneBy({ siteId, month });
  }

  /** False when a notice for the site and month exists already (the unique key decides, so two clicks race safely). */
  async insert(
    em: EntityManager,
    notice: Pick<
      ComplianceNoticeEntity,
      'siteId' | 'month' | 'sentBy' | 'senderOrganisationId' | 'recipients' | 'percentOfBudget' | 'message'
    >,
  ): Promise<boolean> {
    const result: { affectedRows: number } = await em.query(
      `INSERT IGNORE INTO compliance_notice (site_id, month, sent_by, sender_organisation_id,
        recipients, percent_of_budget, message) VALUES (?, ?, ?, ?, ?, ?, ?)`,
      [
        notice.siteId,
        notice.month,
        notice.sentBy,
        notice.senderOrganisationId,
        notice.recipients,
        notice.percentOfBudget,
        notice.message,
      ],
    );
    return result.affectedRows === 1;
  }

  /** Active managers and administrators of the organisation that owns the site. */
  async recipients(organisationId: number): Promise<NoticeRecipient[]> {
    const rows: { userId: number; email: string; displayName: string }[] = await this.db.query(
      `SELECT u.id AS userId, u.email, u.display_name AS displayName FROM membership m JOIN user u ON u.id = m.user_id
       WHERE m.organisation_id = ? AND m.role IN ('manager', 'admin') AND u.status = 'active' ORDER BY u.id`,
      [organisationId],
    );
    return rows.map((r) => ({ ...r, userId: Number(r.userId) }));
  }
}
