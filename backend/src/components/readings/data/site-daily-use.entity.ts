import { Column, Entity, PrimaryColumn, UpdateDateColumn } from 'typeorm';

/**
 * Metered water per site per local day (the site's time zone), kept up to date whenever readings are
 * imported or rolled back. Dashboards, budgets-against-use and reports read this instead of scanning
 * millions of interval readings. An interval is counted on the local day it starts.
 */
@Entity({ name: 'site_daily_use' })
export class SiteDailyUseEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'site_id' })
  siteId!: number;

  @PrimaryColumn({ type: 'date', name: 'local_date' })
  localDate!: string;

  @Column({ type: 'decimal', precision: 14, scale: 4, name: 'gallons' })
  gallons!: string;

  /** Minutes of the day covered by readings (summed over meters), for data completeness. */
  @Column({ type: 'int', unsigned: true, name: 'covered_minutes' })
  coveredMinutes!: number;

  @Column({ type: 'int', unsigned: true, name: 'reading_count' })
  readingCount!: number;

  /** Of `gallons`: from estimated reads, and spread from billing periods. */
  @Column({ type: 'decimal', precision: 16, scale: 4, name: 'estimated_gal', default: 0 })
  estimatedGal!: string;

  @Column({ type: 'decimal', precision: 16, scale: 4, name: 'spread_gal', default: 0 })
  spreadGal!: string;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt!: Date;
}
