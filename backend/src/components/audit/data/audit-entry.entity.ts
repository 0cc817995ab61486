import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** Who changed what, when. Kept without foreign keys so entries outlive what they describe. */
@Entity({ name: 'audit_entry' })
@Index('ix_audit_entity', ['entity', 'entityId'])
@Index('ix_audit_org_at', ['organisationId', 'at'])
export class AuditEntryEntity {
  @PrimaryGeneratedColumn({ type: 'bigint', unsigned: true })
  id!: string;

  @CreateDateColumn({ type: 'datetime', precision: 3 })
  at!: Date;

  @Column({ type: 'int', unsigned: true, nullable: true, name: 'user_id' })
  userId!: number | null;

  @Column({ type: 'int', unsigned: true, nullable: true, name: 'organisation_id' })
  organisationId!: number | null;

  @Column({ type: 'varchar', length: 40 })
  entity!: string;

  @Column({ type: 'varchar', length: 40, name: 'entity_id' })
  entityId!: string;

  @Column({ type: 'varchar', length: 40 })
  action!: string;

  /** JSON: `{ field: [before, after] }` or a small description. */
  @Column({ type: 'longtext', nullable: true })
  changes!: string | null;
}
