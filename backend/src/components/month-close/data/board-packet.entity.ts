import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** A board packet PDF: asked for by a manager, built in the background, kept in file storage. */
@Entity({ name: 'board_packet' })
@Index('ix_board_packet_org', ['organisationId', 'createdAt'])
export class BoardPacketEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'organisation_id' })
  organisationId!: number;

  @Column({ type: 'char', length: 7, name: 'month' })
  month!: string;

  @Column({ type: 'varchar', length: 160, name: 'title' })
  title!: string;

  /** JSON array of site ids, in the order the packet prints them. */
  @Column({ type: 'longtext', name: 'site_ids' })
  siteIds!: string;

  @Column({ type: 'enum', enum: ['queued', 'running', 'done', 'failed'], default: 'queued' })
  status!: 'queued' | 'running' | 'done' | 'failed';

  @Column({ type: 'smallint', unsigned: true, name: 'done_sites', default: 0 })
  doneSites!: number;

  @Column({ type: 'smallint', unsigned: true, name: 'total_sites' })
  totalSites!: number;

  @Column({ type: 'varchar', length: 100, name: 'storage_key', nullable: true })
  storageKey!: string | null;

  @Column({ type: 'int', unsigned: true, name: 'size_bytes', nullable: true })
  sizeBytes!: number | null;

  @Column({ type: 'varchar', length: 500, name: 'error', nullable: true })
  error!: string | null;

  @Column({ type: 'int', unsigned: true, name: 'created_by', nullable: true })
  createdBy!: number | null;

  @Column({ type: 'datetime', precision: 3, name: 'created_at', default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt!: Date;

  @Column({ type: 'datetime', precision: 3, name: 'finished_at', nullable: true })
  finishedAt!: Date | null;
}
