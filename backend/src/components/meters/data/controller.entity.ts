import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { SiteEntity } from '../../sites/data/site.entity';

/** An irrigation controller of a site; `ref` is the id its runtime logs use. */
@Entity({ name: 'controller' })
@Index('uq_controller_site_ref', ['siteId', 'ref'], { unique: true })
export class ControllerEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'site_id' })
  siteId!: number;

  @ManyToOne(() => SiteEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'fk_controller_site' })
  site?: SiteEntity;

  @Column({ type: 'varchar', length: 64 })
  ref!: string;

  @Column({ type: 'varchar', length: 120 })
  name!: string;
}
