import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

/** A retrofit on a site, with the months its savings are measured over (see shared/savings/savings-project.ts). */
@Entity({ name: 'savings_project' })
export class SavingsProjectEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'site_id' })
  siteId!: number;

  @Column({ type: 'varchar', length: 160, name: 'title' })
  title!: string;

  @Column({ type: 'varchar', length: 40, name: 'change_kind' })
  changeKind!: string;

  @Column({ type: 'varchar', length: 2000, name: 'change_description', default: '' })
  changeDescription!: string;

  @Column({ type: 'date', name: 'installed_on' })
  installedOn!: string;

  @Column({ type: 'char', length: 7, name: 'baseline_from' })
  baselineFrom!: string;

  @Column({ type: 'char', length: 7, name: 'baseline_to' })
  baselineTo!: string;

  @Column({ type: 'char', length: 7, name: 'reporting_from' })
  reportingFrom!: string;

  @Column({ type: 'char', length: 7, name: 'reporting_to' })
  reportingTo!: string;

  @Column({ type: 'varchar', length: 20, name: 'model_form' })
  modelForm!: string;

  @Column({ type: 'varchar', length: 12, name: 'status', default: 'planned' })
  status!: 'planned' | 'installed' | 'archived';

  /** When the project was marked installed: the baseline months and model are locked from then on. */
  @Column({ type: 'datetime', precision: 3, name: 'locked_at', nullable: true })
  lockedAt!: Date | null;

  @Column({ type: 'int', unsigned: true, name: 'locked_by', nullable: true })
  lockedBy!: number | null;

  @Column({ type: 'datetime', precision: 3, name: 'archived_at', nullable: true })
  archivedAt!: Date | null;

  @Column({ type: 'int', unsigned: true, name: 'archived_by', nullable: true })
  archivedBy!: number | null;

  /** JSON array of lines: what was installed. */
  @Column({ type: 'longtext', name: 'retrofits', nullable: true })
  retrofits!: string | null;

  @Column({
    type: 'decimal',
    precision: 12,
    scale: 2,
    name: 'installed_cost',
    nullable: true,
    transformer: { to: (v: number | null) => v, from: (v: string | null) => (v === null ? null : Number(v)) },
  })
  installedCost!: number | null;

  @Column({ type: 'char', length: 3, name: 'cost_currency', nullable: true })
  costCurrency!: string | null;

  @Column({ type: 'int', unsigned: true, name: 'created_by', nullable: true })
  createdBy!: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt!: Date;
}
