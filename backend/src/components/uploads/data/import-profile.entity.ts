import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { UPLOAD_KINDS, type UploadKind } from '@shared/ingest/upload-kind';
import { OrganisationEntity } from '../../organisations/data/organisation.entity';

/** A named column mapping an organisation reuses for files from the same source. */
@Entity({ name: 'import_profile' })
@Index('uq_import_profile_org_name', ['organisationId', 'name'], { unique: true })
export class ImportProfileEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'organisation_id' })
  organisationId!: number;

  @ManyToOne(() => OrganisationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisation_id', foreignKeyConstraintName: 'fk_import_profile_org' })
  organisation?: OrganisationEntity;

  @Column({ type: 'varchar', length: 120 })
  name!: string;

  @Column({ type: 'enum', enum: [...UPLOAD_KINDS] })
  kind!: UploadKind;

  @Column({ type: 'text' })
  mapping!: string;

  @Column({ type: 'int', unsigned: true, name: 'created_by', nullable: true })
  createdBy!: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;
}
