import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** One alert raised by the nightly watch: a finding filed for people to act on (see migration 1796215000000). */
@Entity({ name: 'alert' })
export class AlertEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true }) id!: number;
  @Column({ type: 'int', unsigned: true, name: 'site_id' }) siteId!: number;
  @Column({
    type: 'enum',
    enum: ['leak', 'runaway-zone', 'overspend', 'silent-meter', 'weather', 'watering-rules'],
    name: 'kind',
  })
  kind!: string;
  @Column({ type: 'varchar', length: 40, name: 'sub_kind' }) subKind!: string;
  @Column({ type: 'int', unsigned: true, name: 'zone_id', nullable: true }) zoneId!: number | null;
  @Column({ type: 'varchar', length: 200, name: 'finding_key' }) findingKey!: string;
  @Column({ type: 'varchar', length: 160, name: 'condition_key' }) conditionKey!: string;
  @Column({ type: 'datetime', name: 'period_start_utc' }) periodStartUtc!: Date;
  @Column({ type: 'datetime', name: 'period_end_utc' }) periodEndUtc!: Date;
  @Column({ type: 'enum', enum: ['watch', 'act-soon', 'act-now'], name: 'severity' }) severity!: string;
  @Column({ type: 'enum', enum: ['open', 'acknowledged', 'resolved'], name: 'status', default: 'open' })
  status!: string;
  @Column({ type: 'boolean', name: 'ongoing', default: false }) ongoing!: boolean;
  @Column({ type: 'mediumtext', name: 'evidence' }) evidence!: string;
  @Column({ type: 'double', name: 'water_lost_gal', nullable: true }) waterLostGal!: number | null;
  @Column({ type: 'double', name: 'money_lost', nullable: true }) moneyLost!: number | null;
  @Column({ type: 'char', length: 3, name: 'currency', nullable: true }) currency!: string | null;
  @Column({ type: 'text', name: 'explanation' }) explanation!: string;
  @Column({ type: 'datetime', precision: 3, name: 'first_detected_at' }) firstDetectedAt!: Date;
  @Column({ type: 'datetime', precision: 3, name: 'last_seen_at' }) lastSeenAt!: Date;
  @Column({ type: 'datetime', precision: 3, name: 'resolved_at', nullable: true }) resolvedAt!: Date | null;
  @Column({ type: 'int', unsigned: true, name: 'reopen_count', default: 0 }) reopenCount!: number;
  // How it was resolved, and whether the data since confirmed the repair (migration 1796340000000).
  @Column({ type: 'enum', enum: ['fixed', 'not-a-problem', 'other'], name: 'resolution', nullable: true })
  resolution!: string | null;
  @Column({ type: 'datetime', name: 'repaired_at', nullable: true }) repairedAt!: Date | null;
  @Column({ type: 'int', unsigned: true, name: 'resolved_by', nullable: true }) resolvedBy!: number | null;
  @Column({ type: 'int', unsigned: true, name: 'resolver_organisation_id', nullable: true })
  resolverOrganisationId!: number | null;
  @Column({ type: 'enum', enum: ['watching', 'verified', 'not-verified'], name: 'verification', nullable: true })
  verification!: string | null;
  @Column({ type: 'datetime', precision: 3, name: 'verified_at', nullable: true }) verifiedAt!: Date | null;
  @Column({ type: 'mediumtext', name: 'verification_evidence', nullable: true }) verificationEvidence!: string | null;
}
