import type { DataSource, EntityManager } from 'typeorm';
import type { NoticeHistoryDto } from '@shared/reports/compliance-report-dto';
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

  /** A site's notices, newest first, with who sent them from which organisation. */
  async history(
    siteId: number,
    page: { page: number; pageSize: number },
  ): Promise<{ items: NoticeHistoryDto[]; total: number }> {
    const [{ n }]: { n: number | string }[] = await this.db.query(
      'SELECT COUNT(*) AS n FROM compliance_notice WHERE site_id = ?',
      [siteId],
    );
    const rows: {
      month: string;
      sentAt: Date;
      sentBy: string | null;
      senderOrganisation: string | null;
      recipients: number;
      percentOfBudget: number | null;
      message: string;
    }[] = await this.db.query(
      `SELECT n.month, n.sent_at AS sentAt, u.display_name AS sentBy, o.name AS senderOrganisation, n.recipients,
        n.percent_of_budget AS percentOfBudget, n.message
       FROM compliance_notice n LEFT JOIN \`user\` u ON u.id = n.sent_by
       LEFT JOIN organisation o ON o.id = n.sender_organisation_id
       WHERE n.site_id = ? ORDER BY n.sent_at DESC, n.id DESC LIMIT ? OFFSET ?`,
      [siteId, page.pageSize, page.page * page.pageSize],
    );
    return {
      items: rows.map((r) => ({
        month: r.month,
        sentAt: new Date(r.sentAt).toISOString(),
        sentBy: r.sentBy ?? 'Former user',
        senderOrganisation: r.senderOrganisation ?? '',
        recipients: Number(r.recipients),
        percentOfBudget: r.percentOfBudget === null ? null : Number(r.percentOfBudget),
        message: r.message,
      })),
      total: Number(n),
    };
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
