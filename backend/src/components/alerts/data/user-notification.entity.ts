import { Column, Entity, PrimaryColumn } from 'typeorm';

/** How a user wants watch e-mail; no row means a daily digest for every visible site. */
@Entity({ name: 'user_notification' })
export class UserNotificationEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'user_id' }) userId!: number;
  @Column({ type: 'enum', enum: ['each', 'daily', 'none'], name: 'frequency', default: 'daily' }) frequency!: string;
  /** JSON array of followed site ids; null follows every site the user can see. */
  @Column({ type: 'text', name: 'site_ids', nullable: true }) siteIds!: string | null;
  @Column({ type: 'datetime', precision: 3, name: 'updated_at' }) updatedAt!: Date;
}
