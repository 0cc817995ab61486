import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import {
  IRRIGATION_METHODS,
  PLANT_WATER_USE_CATEGORIES,
  type IrrigationMethod,
  type PlantWaterUseCategory,
} from '@shared/budgets/hydrozone';
import { SPECIAL_LANDSCAPE_KINDS, type SpecialLandscapeKind } from '@shared/hydrozones/hydrozone-dto';
import { SiteEntity } from '../../sites/data/site.entity';

/** A hydrozone of a site. Area in ft² whatever unit it was entered in; flows in US gpm / gph. */
@Entity({ name: 'hydrozone' })
@Index('uq_hydrozone_site_name', ['siteId', 'name'], { unique: true })
export class HydrozoneEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'site_id' })
  siteId!: number;

  @ManyToOne(() => SiteEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'fk_hydrozone_site' })
  site?: SiteEntity;

  @Column({ type: 'varchar', length: 120 })
  name!: string;

  @Column({ type: 'double', name: 'area_ft2' })
  areaFt2!: number;

  @Column({ type: 'enum', enum: [...PLANT_WATER_USE_CATEGORIES], name: 'plant_water_use', nullable: true })
  plantWaterUse!: PlantWaterUseCategory | null;

  @Column({ type: 'double', name: 'plant_factor', nullable: true })
  plantFactor!: number | null;

  @Column({ type: 'enum', enum: [...IRRIGATION_METHODS], name: 'irrigation_method' })
  irrigationMethod!: IrrigationMethod;

  @Column({ type: 'double', name: 'efficiency_override', nullable: true })
  efficiencyOverride!: number | null;

  @Column({ type: 'boolean', name: 'special_landscape_area', default: false })
  specialLandscapeArea!: boolean;

  @Column({ type: 'enum', enum: [...SPECIAL_LANDSCAPE_KINDS], name: 'special_landscape_kind', nullable: true })
  specialLandscapeKind!: SpecialLandscapeKind | null;

  @Column({ type: 'double', name: 'design_flow_gpm', nullable: true })
  designFlowGpm!: number | null;

  @Column({ type: 'int', unsigned: true, name: 'emitter_count', nullable: true })
  emitterCount!: number | null;

  @Column({ type: 'double', name: 'emitter_gph', nullable: true })
  emitterGph!: number | null;

  @Column({ type: 'double', name: 'soil_intake_in_per_hour', nullable: true })
  soilIntakeInPerHour!: number | null;

  @Column({ type: 'text' })
  notes!: string;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt!: Date;
}
