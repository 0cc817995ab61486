import { Column, Entity, PrimaryColumn } from 'typeorm';

/** Who runs a scheduled job right now: one row per job, taken by one app instance until it expires. */
@Entity({ name: 'job_lease' })
export class JobLeaseEntity {
  @PrimaryColumn({ type: 'varchar', length: 64 })
  name!: string;

  @Column({ type: 'varchar', length: 64 })
  holder!: string;

  @Column({ type: 'datetime', precision: 3, name: 'leased_until' })
  leasedUntil!: Date;
}
