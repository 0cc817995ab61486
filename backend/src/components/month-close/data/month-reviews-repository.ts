import type { DataSource, EntityManager } from 'typeorm';
import type { MonthReviewDto } from '@shared/month-close/month-close-dto';

interface ReviewRow {
  siteId: number;
  month: string;
  note: string;
  reviewedAt: Date;
  reviewedBy: string | null;
}

/** The review marks of a month; callers check site access first. */
export class MonthReviewsRepository {
  constructor(private readonly db: DataSource) {}

  async ofMonth(siteIds: number[], month: string): Promise<Map<number, MonthReviewDto>> {
    if (!siteIds.length) return new Map();
    const rows: ReviewRow[] = await this.db.query(
      `SELECT r.site_id AS siteId, r.month, r.note, r.reviewed_at AS reviewedAt, u.display_name AS reviewedBy
       FROM site_month_review r LEFT JOIN \`user\` u ON u.id = r.reviewed_by
       WHERE r.site_id IN (?) AND r.month = ?`,
      [siteIds, month],
    );
    return new Map(rows.map((r) => [Number(r.siteId), toDto(r)]));
  }

  /** Writes the mark (a second mark replaces the note); returns the previous note, or null when there was none. */
  async upsert(
    em: EntityManager,
    review: { siteId: number; month: string; userId: number; note: string },
  ): Promise<string | null> {
    const [before]: { note: string }[] = await em.query(
      'SELECT note FROM site_month_review WHERE site_id = ? AND month = ? FOR UPDATE',
      [review.siteId, review.month],
    );
    await em.query(
      `INSERT INTO site_month_review (site_id, month, reviewed_by, reviewed_at, note) VALUES (?, ?, ?, ?, ?)
       ON DUPLICATE KEY UPDATE reviewed_by = VALUES(reviewed_by), reviewed_at = VALUES(reviewed_at),
         note = VALUES(note)`,
      [review.siteId, review.month, review.userId, new Date(), review.note],
    );
    return before ? before.note : null;
  }

  async delete(em: EntityManager, siteId: number, month: string): Promise<boolean> {
    const result: { affectedRows: number } = await em.query(
      'DELETE FROM site_month_review WHERE site_id = ? AND month = ?',
      [siteId, month],
    );
    return result.affectedRows > 0;
  }
}

function toDto(r: ReviewRow): MonthReviewDto {
  return {
    siteId: Number(r.siteId),
    month: r.month,
    note: r.note,
    reviewedBy: r.reviewedBy ?? 'Former user',
    reviewedAt: new Date(r.reviewedAt).toISOString(),
  };
}
