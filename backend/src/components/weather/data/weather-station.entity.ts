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
  STATION_EXPOSURES,
  STATION_SOURCE_KINDS,
  type StationExposure,
  type StationSourceKind,
} from '@shared/weather/weather-station-dto';
import { OrganisationEntity } from '../../organisations/data/organisation.entity';

/** A weather station owned by one organisation; any number of sites may take their weather from it. */
@Entity({ name: 'weather_station' })
@Index('uq_weather_station_org_name', ['organisationId', 'name'], { unique: true })
export class WeatherStationEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id!: number;

  @Column({ type: 'int', unsigned: true, name: 'organisation_id' })
  organisationId!: number;

  @ManyToOne(() => OrganisationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisation_id', foreignKeyConstraintName: 'fk_weather_station_org' })
  organisation?: OrganisationEntity;

  @Column({ type: 'varchar', length: 120 })
  name!: string;

  @Column({ type: 'double' })
  latitude!: number;

  @Column({ type: 'double' })
  longitude!: number;

  @Column({ type: 'double', name: 'elevation_m' })
  elevationM!: number;

  @Column({ type: 'double', name: 'wind_height_m', default: 2 })
  windHeightM!: number;

  /** Chooses the Hargreaves radiation coefficient kRs (FAO-56 Eq. 50). */
  @Column({ type: 'enum', enum: [...STATION_EXPOSURES], default: 'interior' })
  exposure!: StationExposure;

  @Column({ type: 'enum', enum: [...STATION_SOURCE_KINDS], name: 'source_kind', default: 'upload' })
  sourceKind!: StationSourceKind;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt!: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt!: Date;
}
