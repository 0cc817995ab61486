import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { SiteEntity } from '../../sites/data/site.entity';
import { UploadEntity } from './upload.entity';

/** What one upload did to one site (an organisation's file touches several). */
@Entity({ name: 'upload_site' })
@Index('ix_upload_site_site', ['siteId', 'uploadId'])
export class UploadSiteEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'upload_id' })
  uploadId!: number;

  @ManyToOne(() => UploadEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'upload_id', foreignKeyConstraintName: 'fk_upload_site_upload' })
  upload?: UploadEntity;

  @PrimaryColumn({ type: 'int', unsigned: true, name: 'site_id' })
  siteId!: number;

  @ManyToOne(() => SiteEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'fk_upload_site_site' })
  site?: SiteEntity;

  @Column({ type: 'int', unsigned: true, default: 0 })
  accepted!: number;

  @Column({ type: 'int', unsigned: true, default: 0 })
  duplicate!: number;

  @Column({ type: 'int', unsigned: true, default: 0 })
  conflicting!: number;

  @Column({ type: 'int', unsigned: true, default: 0 })
  rejected!: number;
}
