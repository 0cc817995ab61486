import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { VOLUME_UNITS, type VolumeUnit } from '@shared/units/volume-units';
import { MeterEntity } from '../../meters/data/meter.entity';

/**
 * A cumulative register read as the file gave it. `position` tells apart two reads at one instant (a swapped
 * meter's final read and its replacement's initial read), in file order.
 */
@Entity({ name: 'meter_register_read' })
@Index('ix_meter_register_read_upload', ['uploadId'])
export class MeterRegisterReadEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'meter_id' })
  meterId!: number;

  @ManyToOne(() => MeterEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'meter_id', foreignKeyConstraintName: 'fk_meter_register_read_meter' })
  meter?: MeterEntity;

  @PrimaryColumn({ type: 'datetime', name: 'read_at' })
  readAt!: Date;

  @PrimaryColumn({ type: 'tinyint', unsigned: true })
  position!: number;

  @Column({ type: 'decimal', precision: 16, scale: 4, name: 'register_value' })
  registerValue!: string;

  @Column({ type: 'enum', enum: [...VOLUME_UNITS] })
  unit!: VolumeUnit;

  @Column({ type: 'int', unsigned: true, name: 'upload_id' })
  uploadId!: number;

  /** What the file said beside the read: the physical meter's serial, multiplier, dial digits, estimated. */
  @Column({ type: 'varchar', length: 64, nullable: true })
  serial!: string | null;

  @Column({ type: 'double', nullable: true })
  multiplier!: number | null;

  @Column({ type: 'tinyint', unsigned: true, nullable: true })
  digits!: number | null;

  @Column({ type: 'tinyint', unsigned: true, default: 0 })
  estimated!: number;
}
