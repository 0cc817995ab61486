import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { RUNTIME_CAUSES, type RuntimeCause } from '@shared/ingest/ingest-records';
import { ZoneEntity } from './zone.entity';

/** One controller run of one zone (0 minutes for a skipped run), keyed like readings for range scans. */
@Entity({ name: 'runtime_event' })
@Index('ix_runtime_event_upload', ['uploadId'])
export class RuntimeEventEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'zone_id' })
  zoneId!: number;

  @ManyToOne(() => ZoneEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'zone_id', foreignKeyConstraintName: 'fk_runtime_event_zone' })
  zone?: ZoneEntity;

  @PrimaryColumn({ type: 'datetime', name: 'start_utc' })
  startUtc!: Date;

  @Column({ type: 'smallint', unsigned: true })
  minutes!: number;

  @Column({ type: 'enum', enum: [...RUNTIME_CAUSES], nullable: true })
  cause!: RuntimeCause | null;

  @Column({ type: 'decimal', precision: 12, scale: 2, name: 'measured_gallons', nullable: true })
  measuredGallons!: string | null;

  @Column({ type: 'int', unsigned: true, name: 'upload_id' })
  uploadId!: number;
}
