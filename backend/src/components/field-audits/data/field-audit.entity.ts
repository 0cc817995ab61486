import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

/** An irrigation audit of one site, done by one organisation (only its writers may change it). */
@Entity({ name: 'field_audit' })
export class FieldAuditEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'site_id' })
  siteId!: number;

  @Column({ type: 'int', unsigned: true, name: 'organisation_id' })
  organisationId!: number;

  @Column({ type: 'varchar', length: 160 })
  title!: string;

  @Column({ type: 'date', name: 'audited_on' })
  auditedOn!: string;

  @Column({ type: 'char', length: 7, name: 'schedule_month' })
  scheduleMonth!: string;

  @Column({ type: 'tinyint', unsigned: true, name: 'days_per_week', default: 3 })
  daysPerWeek!: number;

  @Column({ type: 'double', name: 'static_pressure_psi', nullable: true })
  staticPressurePsi!: number | null;

  @Column({ type: 'text' })
  notes!: string;

  @Column({ type: 'enum', enum: ['draft', 'complete'], default: 'draft' })
  status!: 'draft' | 'complete';

  @Column({ type: 'int', unsigned: true, name: 'created_by', nullable: true })
  createdBy!: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt!: Date;
}
