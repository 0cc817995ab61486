import { Column, Entity, PrimaryColumn, UpdateDateColumn } from 'typeorm';

/** A site's own watch thresholds (JSON overriding DEFAULT_THRESHOLDS) and irrigation window. */
@Entity({ name: 'site_watch_settings' })
export class SiteWatchSettingsEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'site_id' }) siteId!: number;
  @Column({ type: 'text', name: 'thresholds' }) thresholds!: string;
  @Column({ type: 'tinyint', unsigned: true, name: 'irrigation_start_hour' }) irrigationStartHour!: number;
  @Column({ type: 'tinyint', unsigned: true, name: 'irrigation_end_hour' }) irrigationEndHour!: number;
  @Column({ type: 'int', unsigned: true, name: 'updated_by', nullable: true }) updatedBy!: number | null;
  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' }) updatedAt!: Date;
}
