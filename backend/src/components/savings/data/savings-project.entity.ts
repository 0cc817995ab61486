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

  @Column({ type: 'int', unsigned: true, name: 'created_by', nullable: true })
  createdBy!: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt!: Date;
}
