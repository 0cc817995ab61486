import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { OrganisationEntity } from '../../organisations/data/organisation.entity';

/** A machine-upload key. Only a SHA-256 of the secret is kept (the secret is random, so no slow hash is needed). */
@Entity({ name: 'api_key' })
@Index('uq_api_key_prefix', ['prefix'], { unique: true })
export class ApiKeyEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'organisation_id' })
  organisationId!: number;

  @ManyToOne(() => OrganisationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisation_id', foreignKeyConstraintName: 'fk_api_key_org' })
  organisation?: OrganisationEntity;

  @Column({ type: 'varchar', length: 120 })
  name!: string;

  @Column({ type: 'char', length: 11 })
  prefix!: string;

  @Column({ type: 'char', length: 64, name: 'secret_hash' })
  secretHash!: string;

  @Column({ type: 'int', unsigned: true, name: 'created_by', nullable: true })
  createdBy!: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @Column({ type: 'datetime', precision: 3, name: 'last_used_at', nullable: true })
  lastUsedAt!: Date | null;

  @Column({ type: 'datetime', precision: 3, name: 'revoked_at', nullable: true })
  revokedAt!: Date | null;
}
