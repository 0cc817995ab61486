import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { VOLUME_UNITS, type VolumeUnit } from '@shared/units/volume-units';
import { MeterEntity } from '../../meters/data/meter.entity';

/**
 * One interval volume. The primary key (meter, start, minutes) is also the clustering order, so a meter's readings
 * over a period are one range scan for the nightly job and the dashboards; no surrogate id keeps rows ~30 bytes.
 * Volumes are gallons; the value and unit as the file gave them are kept beside.
 */
@Entity({ name: 'meter_reading' })
@Index('ix_meter_reading_upload', ['uploadId'])
export class MeterReadingEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'meter_id' })
  meterId!: number;

  @ManyToOne(() => MeterEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'meter_id', foreignKeyConstraintName: 'fk_meter_reading_meter' })
  meter?: MeterEntity;

  @PrimaryColumn({ type: 'datetime', name: 'start_utc' })
  startUtc!: Date;

  /** MEDIUMINT: volumes differenced from monthly register reads span weeks. */
  @PrimaryColumn({ type: 'mediumint', unsigned: true })
  minutes!: number;

  @Column({ type: 'decimal', precision: 12, scale: 4, name: 'volume_gal' })
  volumeGal!: string;

  @Column({ type: 'decimal', precision: 16, scale: 6, name: 'original_value' })
  originalValue!: string;

  @Column({ type: 'enum', enum: [...VOLUME_UNITS], name: 'original_unit' })
  originalUnit!: VolumeUnit;

  @Column({ type: 'int', unsigned: true, name: 'upload_id' })
  uploadId!: number;

  /** `READING_FLAGS`: estimated, spread from a bill by ETo, spread evenly. */
  @Column({ type: 'tinyint', unsigned: true, default: 0 })
  flags!: number;
}
