import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

/** A fault found during an audit (tilted head, broken lateral…), optionally tied to a zone test. */
@Entity({ name: 'field_audit_fault' })
export class FieldAuditFaultEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'audit_id' })
  auditId!: number;

  @Column({ type: 'int', unsigned: true, name: 'zone_test_id', nullable: true })
  zoneTestId!: number | null;

  @Column({ type: 'varchar', length: 30 })
  kind!: string;

  @Column({ type: 'varchar', length: 120 })
  location!: string;

  @Column({ type: 'text' })
  description!: string;

  @Column({ type: 'enum', enum: ['open', 'fixed'], default: 'open' })
  status!: 'open' | 'fixed';

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt!: Date;
}
