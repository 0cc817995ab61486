import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** Who did what to an alert, and when; the watch itself acts with a null user. */
@Entity({ name: 'alert_event' })
export class AlertEventEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true }) id!: number;
  @Column({ type: 'int', unsigned: true, name: 'alert_id' }) alertId!: number;
  @Column({ type: 'int', unsigned: true, name: 'user_id', nullable: true }) userId!: number | null;
  @Column({
    type: 'enum',
    enum: ['opened', 'acknowledged', 'resolved', 'reopened', 'note', 'updated', 'verified', 'not-verified'],
    name: 'action',
  })
  action!: string;
  @Column({ type: 'varchar', length: 2000, name: 'note', nullable: true }) note!: string | null;
  @Column({ type: 'datetime', precision: 3, name: 'at' }) at!: Date;
}
