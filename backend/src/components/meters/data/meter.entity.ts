import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import { METER_PURPOSES, WATER_SOURCES, type MeterPurpose, type WaterSource } from '@shared/meters/meter';
import { VOLUME_UNITS, type VolumeUnit } from '@shared/units/volume-units';
import { SiteEntity } from '../../sites/data/site.entity';

/** A water meter of a site; `ref` is the serial or identifier the utility's files use. */
@Entity({ name: 'meter' })
@Index('uq_meter_site_ref', ['siteId', 'ref'], { unique: true })
export class MeterEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'site_id' })
  siteId!: number;

  @ManyToOne(() => SiteEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'fk_meter_site' })
  site?: SiteEntity;

  @Column({ type: 'varchar', length: 64 })
  ref!: string;

  @Column({ type: 'enum', enum: [...VOLUME_UNITS] })
  unit!: VolumeUnit;

  /** The current register: dial units × multiplier = volume in `unit`. */
  @Column({ type: 'double', name: 'register_multiplier', default: 1 })
  registerMultiplier!: number;

  /** Whole-number digits on the current register's dial (rollover); null when unknown. */
  @Column({ type: 'tinyint', unsigned: true, name: 'register_digits', nullable: true })
  registerDigits!: number | null;

  @Column({ type: 'enum', enum: [...METER_PURPOSES] })
  purpose!: MeterPurpose;

  @Column({ type: 'enum', enum: [...WATER_SOURCES], name: 'water_source' })
  waterSource!: WaterSource;

  /**
   * When the current register was installed (after a swap, the swap time); readings before the meter's first install
   * are refused.
   */
  @Column({ type: 'datetime', name: 'installed_at', nullable: true })
  installedAt!: Date | null;

  @Column({ type: 'datetime', name: 'removed_at', nullable: true })
  removedAt!: Date | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt!: Date;
}
