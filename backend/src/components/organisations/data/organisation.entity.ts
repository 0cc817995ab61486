import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { OrganisationKind } from '@shared/auth/roles';

export type UnitSystem = 'us' | 'metric';

@Entity({ name: 'organisation' })
export class OrganisationEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'varchar', length: 160, unique: true })
  name!: string;

  @Column({ type: 'enum', enum: ['property-manager', 'contractor', 'utility'] })
  kind!: OrganisationKind;

  @Column({ type: 'enum', enum: ['us', 'metric'], default: 'us', name: 'unit_system' })
  unitSystem!: UnitSystem;

  /** The day/month order of the organisation's usual exports, for files whose dates fit both. */
  @Column({ type: 'enum', enum: ['month-first', 'day-first'], name: 'date_order', nullable: true })
  dateOrder!: 'month-first' | 'day-first' | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;
}
