import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

export type MailStatus = 'queued' | 'sending' | 'sent' | 'failed';

/**
 * An e-mail waiting to go out, or gone. Mail is written here in the same transaction as the change
 * that causes it, then delivered by whichever app instance claims it first, and retried while the
 * SMTP server is down.
 */
@Entity({ name: 'mail_message' })
@Index('ix_mail_message_due', ['status', 'nextAttemptAt'])
@Index('uq_mail_message_dedupe', ['dedupeKey'], { unique: true })
export class MailMessageEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  /** Same key, same message: a second enqueue with it is ignored (e.g. one digest per user per night). */
  @Column({ type: 'varchar', length: 191, name: 'dedupe_key' })
  dedupeKey!: string;

  @Column({ type: 'varchar', length: 254, name: 'to_address' })
  to!: string;

  @Column({ type: 'varchar', length: 300 })
  subject!: string;

  @Column({ type: 'longtext', name: 'body_text' })
  text!: string;

  @Column({ type: 'longtext', nullable: true, name: 'body_html' })
  html!: string | null;

  /** Organisations the message was sent for, comma-separated (the development outbox filters on them). */
  @Column({ type: 'varchar', length: 255, nullable: true, name: 'organisation_ids' })
  organisationIds!: string | null;

  @Column({ type: 'enum', enum: ['queued', 'sending', 'sent', 'failed'], default: 'queued' })
  status!: MailStatus;

  @Column({ type: 'smallint', unsigned: true, default: 0 })
  attempts!: number;

  @Column({ type: 'datetime', precision: 3, name: 'next_attempt_at' })
  nextAttemptAt!: Date;

  @Column({ type: 'varchar', length: 64, nullable: true, name: 'claimed_by' })
  claimedBy!: string | null;

  @Column({ type: 'datetime', precision: 3, nullable: true, name: 'claimed_until' })
  claimedUntil!: Date | null;

  @Column({ type: 'varchar', length: 500, nullable: true, name: 'last_error' })
  lastError!: string | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @Column({ type: 'datetime', precision: 3, nullable: true, name: 'sent_at' })
  sentAt!: Date | null;
}
