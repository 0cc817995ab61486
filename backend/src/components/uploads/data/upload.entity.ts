import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { UPLOAD_KINDS, type UploadKind } from '@shared/ingest/upload-kind';
import { UPLOAD_STATUSES, type UploadStatus } from '@shared/uploads/upload';
import { OrganisationEntity } from '../../organisations/data/organisation.entity';
import { SiteEntity } from '../../sites/data/site.entity';

/**
 * One file sent to a site, or to a whole organisation (`siteId` null: rows routed by meter/controller to their
 * sites): who, what, how it was read and what came of it. Rows point back here for roll-back.
 */
@Entity({ name: 'upload' })
@Index('ix_upload_site_created', ['siteId', 'createdAt'])
@Index('ix_upload_site_sha', ['siteId', 'sha256'])
@Index('ix_upload_org_sha', ['organisationId', 'sha256'])
export class UploadEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'site_id', nullable: true })
  siteId!: number | null;

  @ManyToOne(() => SiteEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'fk_upload_site' })
  site?: SiteEntity;

  /** Whose upload it is (always written by the app; a site's upload without it belongs to the site's owner). */
  @Column({ type: 'int', unsigned: true, name: 'organisation_id', nullable: true })
  organisationId!: number | null;

  @ManyToOne(() => OrganisationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisation_id', foreignKeyConstraintName: 'fk_upload_org' })
  organisation?: OrganisationEntity;

  @Column({ type: 'int', unsigned: true, name: 'uploaded_by', nullable: true })
  uploadedBy!: number | null;

  @Column({ type: 'int', unsigned: true, name: 'api_key_id', nullable: true })
  apiKeyId!: number | null;

  @Column({ type: 'enum', enum: [...UPLOAD_KINDS], nullable: true })
  kind!: UploadKind | null;

  @Column({ type: 'varchar', length: 255, name: 'file_name' })
  fileName!: string;

  @Column({ type: 'bigint', unsigned: true, name: 'size_bytes', default: 0 })
  sizeBytes!: string;

  @Column({ type: 'varchar', length: 100, name: 'storage_key', nullable: true })
  storageKey!: string | null;

  @Column({ type: 'char', length: 64, nullable: true })
  sha256!: string | null;

  /** JSON of the ColumnMapping used. */
  @Column({ type: 'text', nullable: true })
  mapping!: string | null;

  /** JSON of the choices sent with the file (replace conflicts, row-error policy). */
  @Column({ type: 'varchar', length: 500, nullable: true })
  options!: string | null;

  /** A random string the browser sends with the file, so it can find this upload while it is processing. */
  @Column({ type: 'varchar', length: 40, name: 'client_ref', nullable: true })
  clientRef!: string | null;

  @Column({ type: 'enum', enum: [...UPLOAD_STATUSES] })
  status!: UploadStatus;

  @Column({ type: 'int', unsigned: true, name: 'rows_read', default: 0 })
  rowsRead!: number;

  @Column({ type: 'int', unsigned: true, default: 0 })
  accepted!: number;

  @Column({ type: 'int', unsigned: true, default: 0 })
  duplicate!: number;

  @Column({ type: 'int', unsigned: true, default: 0 })
  conflicting!: number;

  @Column({ type: 'int', unsigned: true, default: 0 })
  replaced!: number;

  @Column({ type: 'int', unsigned: true, default: 0 })
  rejected!: number;

  /** Distinct meter/controller refs in the file that no site has (such an upload may be sent again). */
  @Column({ type: 'int', unsigned: true, name: 'unknown_refs', default: 0 })
  unknownRefs!: number;

  @Column({ type: 'text', name: 'error_summary', nullable: true })
  errorSummary!: string | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @Column({ type: 'datetime', precision: 3, name: 'finished_at', nullable: true })
  finishedAt!: Date | null;
}
