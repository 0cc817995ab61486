import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { MeterEntity } from './meter.entity';

/**
 * An earlier register of a meter, replaced in a meter swap; register reads are never differenced across two. A swap
 * an upload recognised (the serial changed) names that upload, and goes when it is rolled back.
 */
@Entity({ name: 'meter_register_period' })
@Index('ix_meter_register_period_meter', ['meterId', 'installedAt'])
@Index('ix_meter_register_period_upload', ['uploadId'])
export class MeterRegisterPeriodEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'meter_id' })
  meterId!: number;

  @ManyToOne(() => MeterEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'meter_id', foreignKeyConstraintName: 'fk_meter_register_period_meter' })
  meter?: MeterEntity;

  @Column({ type: 'datetime', name: 'installed_at' })
  installedAt!: Date;

  @Column({ type: 'datetime', name: 'removed_at' })
  removedAt!: Date;

  @Column({ type: 'double' })
  multiplier!: number;

  @Column({ type: 'tinyint', unsigned: true, nullable: true })
  digits!: number | null;

  @Column({ type: 'varchar', length: 64, nullable: true })
  serial!: string | null;

  @Column({ type: 'int', unsigned: true, name: 'upload_id', nullable: true })
  uploadId!: number | null;
}
