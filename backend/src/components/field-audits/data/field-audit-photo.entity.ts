import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A photo of a fault; the bytes live in platform/storage under `storageKey` (content-addressed). */
@Entity({ name: 'field_audit_photo' })
export class FieldAuditPhotoEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'fault_id' })
  faultId!: number;

  @Column({ type: 'varchar', length: 80, name: 'storage_key' })
  storageKey!: string;

  @Column({ type: 'varchar', length: 20, name: 'content_type' })
  contentType!: string;

  @Column({ type: 'int', unsigned: true, name: 'size_bytes' })
  sizeBytes!: number;

  @Column({ type: 'int', unsigned: true, name: 'created_by', nullable: true })
  createdBy!: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;
}
