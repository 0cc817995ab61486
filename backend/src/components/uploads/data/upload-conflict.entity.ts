import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { VOLUME_UNITS, type VolumeUnit } from '@shared/units/volume-units';
import { UploadEntity } from './upload.entity';

/**
 * An interval reading an upload did not store, kept so a person can decide later: `stored` — the file's value for
 * a reading already stored with another (one row per reading); `in-file` — one row per file row of a reading the
 * file gives twice with different values.
 */
@Entity({ name: 'upload_conflict' })
@Index('ix_upload_conflict_upload', ['uploadId', 'kind', 'resolved'])
export class UploadConflictEntity {
  @PrimaryGeneratedColumn({ type: 'bigint', unsigned: true })
  id!: string;

  @Column({ type: 'int', unsigned: true, name: 'upload_id' })
  uploadId!: number;

  @ManyToOne(() => UploadEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'upload_id', foreignKeyConstraintName: 'fk_upload_conflict_upload' })
  upload?: UploadEntity;

  @Column({ type: 'enum', enum: ['stored', 'in-file'] })
  kind!: 'stored' | 'in-file';

  @Column({ type: 'int', unsigned: true, name: 'meter_id' })
  meterId!: number;

  @Column({ type: 'datetime', name: 'start_utc' })
  startUtc!: Date;

  @Column({ type: 'mediumint', unsigned: true })
  minutes!: number;

  @Column({ type: 'decimal', precision: 12, scale: 4, name: 'volume_gal' })
  volumeGal!: string;

  @Column({ type: 'decimal', precision: 16, scale: 6, name: 'original_value' })
  originalValue!: string;

  @Column({ type: 'enum', enum: [...VOLUME_UNITS], name: 'original_unit' })
  originalUnit!: VolumeUnit;

  @Column({ type: 'tinyint', unsigned: true, default: 0 })
  flags!: number;

  @Column({ type: 'int', unsigned: true, name: 'row_no' })
  rowNo!: number;

  @Column({ type: 'tinyint', unsigned: true, default: 0 })
  resolved!: number;
}
