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
import type { BillingUnit } from '@shared/rates/rate-schedule';
import { SiteEntity } from '../../sites/data/site.entity';

/** A site's water rate schedule; the volume charge (uniform, tiered, budget-based) is JSON shaped as shared/rates. */
@Entity({ name: 'rate_schedule' })
@Index('uq_rate_schedule_site_from', ['siteId', 'effectiveFrom'], { unique: true })
export class RateScheduleEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'site_id' })
  siteId!: number;

  @ManyToOne(() => SiteEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'fk_rate_schedule_site' })
  site?: SiteEntity;

  @Column({ type: 'varchar', length: 120 })
  name!: string;

  @Column({ type: 'enum', enum: ['ccf', 'kgal'] })
  unit!: BillingUnit;

  @Column({ type: 'char', length: 3, default: 'USD' })
  currency!: string;

  @Column({ type: 'double', name: 'fixed_charge_per_period' })
  fixedChargePerPeriod!: number;

  @Column({ type: 'text' })
  structure!: string;

  @Column({ type: 'char', length: 10, name: 'effective_from' })
  effectiveFrom!: string;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt!: Date;
}
