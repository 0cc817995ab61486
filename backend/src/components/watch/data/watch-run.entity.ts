import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** One run of the nightly watch: what it looked at, what it filed, which sites failed and why. */
@Entity({ name: 'watch_run' })
export class WatchRunEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true }) id!: number;
  /** Null for the scheduled run over every site. */
  @Column({ type: 'int', unsigned: true, name: 'organisation_id', nullable: true }) organisationId!: number | null;
  @Column({ type: 'int', unsigned: true, name: 'requested_by', nullable: true }) requestedBy!: number | null;
  @Column({ type: 'enum', enum: ['scheduled', 'manual', 'recheck'], name: 'trigger' }) trigger!: string;
  @Column({ type: 'enum', enum: ['running', 'done', 'failed'], name: 'status' }) status!: string;
  @Column({ type: 'datetime', name: 'range_from_utc', nullable: true }) rangeFromUtc!: Date | null;
  @Column({ type: 'datetime', name: 'range_to_utc' }) rangeToUtc!: Date;
  @Column({ type: 'datetime', precision: 3, name: 'started_at' }) startedAt!: Date;
  @Column({ type: 'datetime', precision: 3, name: 'finished_at', nullable: true }) finishedAt!: Date | null;
  @Column({ type: 'int', unsigned: true, name: 'sites_checked' }) sitesChecked!: number;
  @Column({ type: 'int', unsigned: true, name: 'sites_skipped' }) sitesSkipped!: number;
  @Column({ type: 'int', unsigned: true, name: 'findings' }) findings!: number;
  @Column({ type: 'int', unsigned: true, name: 'alerts_raised' }) alertsRaised!: number;
  @Column({ type: 'int', unsigned: true, name: 'alerts_updated' }) alertsUpdated!: number;
  @Column({ type: 'int', unsigned: true, name: 'alerts_reopened' }) alertsReopened!: number;
  @Column({ type: 'int', unsigned: true, name: 'mails_queued' }) mailsQueued!: number;
  /** JSON array of site ids when the run covers chosen sites only. */
  @Column({ type: 'text', name: 'site_ids', nullable: true }) siteIds!: string | null;
  @Column({ type: 'int', unsigned: true, name: 'sites_total', default: 0 }) sitesTotal!: number;
  @Column({ type: 'int', unsigned: true, name: 'sites_done', default: 0 }) sitesDone!: number;
  /** JSON array of { siteId, siteName, message }: checks skipped or weakened, not failures. */
  @Column({ type: 'mediumtext', name: 'warnings', nullable: true }) warnings!: string | null;
  /** JSON array of { siteId, message }. */
  @Column({ type: 'mediumtext', name: 'errors', nullable: true }) errors!: string | null;
}
