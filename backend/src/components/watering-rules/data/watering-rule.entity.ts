import { Column, Entity, PrimaryColumn, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

/** One stage of an agency's watering rule (see migration 1796340000000). Weekday lists are "0,2,4" (0 = Sunday). */
@Entity({ name: 'watering_rule' })
export class WateringRuleEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true }) id!: number;
  @Column({ type: 'int', unsigned: true, name: 'organisation_id' }) organisationId!: number;
  @Column({ type: 'varchar', length: 120, name: 'name' }) name!: string;
  @Column({ type: 'varchar', length: 60, name: 'stage' }) stage!: string;
  @Column({ type: 'enum', enum: ['any', 'weekdays', 'odd-even', 'assigned'], name: 'day_mode' }) dayMode!: string;
  @Column({ type: 'varchar', length: 20, name: 'weekdays', default: '' }) weekdays!: string;
  @Column({ type: 'tinyint', unsigned: true, name: 'start_hour' }) startHour!: number;
  @Column({ type: 'tinyint', unsigned: true, name: 'end_hour' }) endHour!: number;
  @Column({ type: 'smallint', unsigned: true, name: 'max_station_minutes', nullable: true })
  maxStationMinutes!: number | null;
  @Column({ type: 'date', name: 'in_force_from' }) inForceFrom!: string;
  @Column({ type: 'date', name: 'in_force_to', nullable: true }) inForceTo!: string | null;
  @Column({ type: 'int', unsigned: true, name: 'updated_by', nullable: true }) updatedBy!: number | null;
  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' }) updatedAt!: Date;
}

/** A site under a rule, with its address number (odd/even dates) or assigned weekdays. */
@Entity({ name: 'watering_rule_site' })
export class WateringRuleSiteEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'rule_id' }) ruleId!: number;
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'site_id' }) siteId!: number;
  @Column({ type: 'int', unsigned: true, name: 'address_number', nullable: true }) addressNumber!: number | null;
  @Column({ type: 'varchar', length: 20, name: 'assigned_weekdays', default: '' }) assignedWeekdays!: string;
}
