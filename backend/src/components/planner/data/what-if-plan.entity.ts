import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

/** A what-if plan for a site: its zone changes are JSON shaped as shared/planner's ZoneChange[]. */
@Entity({ name: 'what_if_plan' })
export class WhatIfPlanEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'site_id' })
  siteId!: number;

  @Column({ type: 'varchar', length: 160 })
  title!: string;

  @Column({ type: 'text' })
  notes!: string;

  @Column({ type: 'smallint', unsigned: true, name: 'weather_year' })
  weatherYear!: number;

  @Column({ type: 'double', name: 'cost_of_work', default: 0 })
  costOfWork!: number;

  @Column({ type: 'char', length: 3, default: 'USD' })
  currency!: string;

  @Column({ type: 'double', name: 'smart_controller_percent', nullable: true })
  smartControllerPercent!: number | null;

  @Column({ type: 'boolean', name: 'rain_sensor', default: false })
  rainSensor!: boolean;

  @Column({ type: 'text', name: 'zone_changes' })
  zoneChanges!: string;

  @Column({ type: 'enum', enum: ['draft', 'carried-out'], default: 'draft' })
  status!: 'draft' | 'carried-out';

  @Column({ type: 'int', unsigned: true, name: 'savings_project_id', nullable: true })
  savingsProjectId!: number | null;

  @Column({ type: 'date', name: 'carried_out_on', nullable: true })
  carriedOutOn!: string | null;

  @Column({ type: 'int', unsigned: true, name: 'created_by', nullable: true })
  createdBy!: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt!: Date;
}
