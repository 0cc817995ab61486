import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A budget notice mailed to a site's managers; unique per site and month so it is sent once. */
@Entity({ name: 'compliance_notice' })
export class ComplianceNoticeEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'site_id' })
  siteId!: number;

  @Column({ type: 'char', length: 7, name: 'month' })
  month!: string;

  @Column({ type: 'int', unsigned: true, name: 'sent_by', nullable: true })
  sentBy!: number | null;

  @Column({ type: 'int', unsigned: true, name: 'sender_organisation_id' })
  senderOrganisationId!: number;

  @Column({ type: 'smallint', unsigned: true, name: 'recipients' })
  recipients!: number;

  @Column({ type: 'double', name: 'percent_of_budget', nullable: true })
  percentOfBudget!: number | null;

  @Column({ type: 'varchar', length: 2000, name: 'message', default: '' })
  message!: string;

  @Column({ type: 'datetime', precision: 3, name: 'sent_at', default: () => 'CURRENT_TIMESTAMP(3)' })
  sentAt!: Date;
}
