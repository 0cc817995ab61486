import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { VOLUME_UNITS, type VolumeUnit } from '@shared/units/volume-units';
import { MeterEntity } from '../../meters/data/meter.entity';

/**
 * A billing period as the file gave it (both dates local and included). Its usage is also spread over the days into
 * `meter_reading` (flagged), stored under the same upload; `spread` says how.
 */
@Entity({ name: 'meter_billing_period' })
@Index('ix_meter_billing_period_upload', ['uploadId'])
export class MeterBillingPeriodEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'meter_id' })
  meterId!: number;

  @ManyToOne(() => MeterEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'meter_id', foreignKeyConstraintName: 'fk_meter_billing_period_meter' })
  meter?: MeterEntity;

  @PrimaryColumn({ type: 'date', name: 'start_date' })
  startDate!: string;

  @Column({ type: 'date', name: 'end_date' })
  endDate!: string;

  @Column({ type: 'decimal', precision: 14, scale: 4, name: 'volume_gal' })
  volumeGal!: string;

  @Column({ type: 'decimal', precision: 16, scale: 6, name: 'original_value' })
  originalValue!: string;

  @Column({ type: 'enum', enum: [...VOLUME_UNITS], name: 'original_unit' })
  originalUnit!: VolumeUnit;

  @Column({ type: 'tinyint', unsigned: true, default: 0 })
  estimated!: number;

  @Column({ type: 'enum', enum: ['eto', 'even'], nullable: true })
  spread!: 'eto' | 'even' | null;

  @Column({ type: 'int', unsigned: true, name: 'upload_id' })
  uploadId!: number;
}
