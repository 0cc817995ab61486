import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  OneToMany,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import type { SiteKind } from '@shared/sites/site';
import { OrganisationEntity } from '../../organisations/data/organisation.entity';
import { WeatherStationEntity } from '../../weather/data/weather-station.entity';
import { SiteShareEntity } from './site-share.entity';
import { SiteTagEntity } from './site-tag.entity';

@Entity({ name: 'site' })
@Index('uq_site_org_name', ['organisationId', 'name'], { unique: true })
export class SiteEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'organisation_id' })
  organisationId!: number;

  @ManyToOne(() => OrganisationEntity, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'organisation_id' })
  organisation?: OrganisationEntity;

  @Column({ type: 'varchar', length: 120 })
  name!: string;

  @Column({ type: 'enum', enum: ['hoa-common-area', 'office-park', 'school-ground', 'streetscape', 'park', 'other'] })
  kind!: SiteKind;

  @Column({ type: 'varchar', length: 300 })
  address!: string;

  @Column({ type: 'varchar', length: 64, name: 'time_zone' })
  timeZone!: string;

  @Column({ type: 'text' })
  notes!: string;

  /** The station whose weather drives the site's budget; several sites may share one. */
  @Column({ type: 'int', unsigned: true, name: 'weather_station_id', nullable: true })
  weatherStationId!: number | null;

  @ManyToOne(() => WeatherStationEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'weather_station_id', foreignKeyConstraintName: 'fk_site_weather_station' })
  weatherStation?: WeatherStationEntity;

  @OneToMany(() => SiteTagEntity, (t) => t.site, { cascade: true })
  tags?: SiteTagEntity[];

  @OneToMany(() => SiteShareEntity, (s) => s.site)
  shares?: SiteShareEntity[];

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt!: Date;
}
