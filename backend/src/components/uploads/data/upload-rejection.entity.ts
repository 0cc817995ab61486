import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { REJECTION_KINDS, type RejectionKind } from '@shared/uploads/upload';
import { UploadEntity } from './upload.entity';

/** One rejected row (or conflict, or notice) of an upload, with where it is and why. */
@Entity({ name: 'upload_rejection' })
@Index('ix_upload_rejection_upload', ['uploadId', 'rowNo'])
export class UploadRejectionEntity {
  @PrimaryGeneratedColumn({ type: 'bigint', unsigned: true })
  id!: string;

  @Column({ type: 'int', unsigned: true, name: 'upload_id' })
  uploadId!: number;

  @ManyToOne(() => UploadEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'upload_id', foreignKeyConstraintName: 'fk_upload_rejection_upload' })
  upload?: UploadEntity;

  @Column({ type: 'int', unsigned: true, name: 'row_no' })
  rowNo!: number;

  @Column({ type: 'smallint', unsigned: true, name: 'column_no', nullable: true })
  columnNo!: number | null;

  @Column({ type: 'enum', enum: [...REJECTION_KINDS] })
  kind!: RejectionKind;

  @Column({ type: 'varchar', length: 500 })
  message!: string;

  /** With kind `unknown`: the meter/controller ref no site has, and how many rows named it. */
  @Column({ type: 'varchar', length: 64, nullable: true })
  ref!: string | null;

  @Column({ type: 'enum', enum: ['meter', 'controller'], name: 'ref_field', nullable: true })
  refField!: 'meter' | 'controller' | null;

  @Column({ type: 'int', unsigned: true, name: 'ref_rows', nullable: true })
  refRows!: number | null;
}
