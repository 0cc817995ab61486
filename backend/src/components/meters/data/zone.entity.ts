import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { ControllerEntity } from './controller.entity';

/** A controller station (valve). `station` is text because logs name stations "3" or "A1". */
@Entity({ name: 'zone' })
@Index('uq_zone_controller_station', ['controllerId', 'station'], { unique: true })
export class ZoneEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'controller_id' })
  controllerId!: number;

  @ManyToOne(() => ControllerEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'controller_id', foreignKeyConstraintName: 'fk_zone_controller' })
  controller?: ControllerEntity;

  @Column({ type: 'varchar', length: 16 })
  station!: string;

  @Column({ type: 'varchar', length: 120 })
  name!: string;

  /** Linked later by the hydrozones component (its foreign key is theirs to add). */
  @Column({ type: 'int', unsigned: true, name: 'hydrozone_id', nullable: true })
  hydrozoneId!: number | null;

  @Column({ type: 'double', name: 'design_gpm', nullable: true })
  designGpm!: number | null;

  @Column({ type: 'int', unsigned: true, name: 'emitter_count', nullable: true })
  emitterCount!: number | null;

  @Column({ type: 'double', name: 'emitter_gph', nullable: true })
  emitterGph!: number | null;
}
