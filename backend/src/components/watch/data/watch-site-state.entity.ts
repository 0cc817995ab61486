import { Column, Entity, PrimaryColumn } from 'typeorm';

/** Where the watch left off for one site, so a night only re-reads sites with new data. */
@Entity({ name: 'watch_site_state' })
export class WatchSiteStateEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'site_id' }) siteId!: number;
  /** Latest reading or runtime start seen at the last check. */
  @Column({ type: 'datetime', name: 'last_data_utc', nullable: true }) lastDataUtc!: Date | null;
  @Column({ type: 'datetime', name: 'last_checked_as_of_utc', nullable: true }) lastCheckedAsOfUtc!: Date | null;
  /** The site's local date of the last scheduled check (one scheduled check per local night). */
  @Column({ type: 'date', name: 'last_night', nullable: true }) lastNight!: string | null;
}
