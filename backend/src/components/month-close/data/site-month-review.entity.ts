import { Column, Entity, PrimaryColumn } from 'typeorm';

/** A manager's mark that a site's month was looked at, with what they noted (one per site and month). */
@Entity({ name: 'site_month_review' })
export class SiteMonthReviewEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'site_id' })
  siteId!: number;

  @PrimaryColumn({ type: 'char', length: 7, name: 'month' })
  month!: string;

  @Column({ type: 'int', unsigned: true, name: 'reviewed_by', nullable: true })
  reviewedBy!: number | null;

  @Column({ type: 'datetime', precision: 3, name: 'reviewed_at', default: () => 'CURRENT_TIMESTAMP(3)' })
  reviewedAt!: Date;

  @Column({ type: 'varchar', length: 2000, name: 'note', default: '' })
  note!: string;
}
