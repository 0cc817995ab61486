import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { UploadEntity } from './upload.entity';

/** A stored row an upload overwrote (replace conflicts), kept so rolling the upload back restores it. */
@Entity({ name: 'upload_replacement' })
@Index('ix_upload_replacement_upload', ['uploadId'])
export class UploadReplacementEntity {
  @PrimaryGeneratedColumn({ type: 'bigint', unsigned: true })
  id!: string;

  @Column({ type: 'int', unsigned: true, name: 'upload_id' })
  uploadId!: number;

  @ManyToOne(() => UploadEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'upload_id', foreignKeyConstraintName: 'fk_upload_replacement_upload' })
  upload?: UploadEntity;

  /** `meter_reading`, `runtime_event` or `meter_register_read`. */
  @Column({ type: 'varchar', length: 40, name: 'target_table' })
  targetTable!: string;

  /** JSON of the whole previous row. */
  @Column({ type: 'text', name: 'previous_row' })
  previousRow!: string;
}
