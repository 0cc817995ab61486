import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

/**
 * A catch-can test of one hydrozone. The zone's name and area are copied at test time, so the record still reads
 * if the hydrozone is later renamed or deleted. Catches and pressures are JSON arrays.
 */
@Entity({ name: 'field_audit_zone_test' })
export class FieldAuditZoneTestEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'audit_id' })
  auditId!: number;

  @Column({ type: 'int', unsigned: true, name: 'hydrozone_id', nullable: true })
  hydrozoneId!: number | null;

  @Column({ type: 'varchar', length: 120, name: 'hydrozone_name' })
  hydrozoneName!: string;

  @Column({ type: 'double', name: 'hydrozone_area_ft2' })
  hydrozoneAreaFt2!: number;

  @Column({ type: 'varchar', length: 20, name: 'head_type' })
  headType!: string;

  @Column({ type: 'double', name: 'run_minutes' })
  runMinutes!: number;

  @Column({ type: 'varchar', length: 4, name: 'catch_unit' })
  catchUnit!: string;

  @Column({ type: 'double', name: 'throat_diameter', nullable: true })
  throatDiameter!: number | null;

  @Column({ type: 'varchar', length: 4, name: 'throat_unit', nullable: true })
  throatUnit!: string | null;

  @Column({ type: 'text' })
  catches!: string;

  @Column({ type: 'text' })
  pressures!: string;

  @Column({ type: 'double', name: 'soil_intake_in_per_hour', nullable: true })
  soilIntakeInPerHour!: number | null;

  @Column({ type: 'double', name: 'slope_percent', nullable: true })
  slopePercent!: number | null;

  @Column({ type: 'text' })
  notes!: string;

  @Column({ type: 'datetime', precision: 3, name: 'applied_at', nullable: true })
  appliedAt!: Date | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt!: Date;
}
