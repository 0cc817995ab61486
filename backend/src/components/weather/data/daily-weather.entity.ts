import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { DailyWeatherMethod } from '@shared/weather/weather-station-dto';
import { WeatherStationEntity } from './weather-station.entity';

/**
 * One day of a station's weather. ETo or rain may be null when the source had no value; the budget then
 * fills it from the monthly normals and flags the day.
 */
@Entity({ name: 'daily_weather' })
@Index('uq_daily_weather_station_date', ['stationId', 'date'], { unique: true })
export class DailyWeatherEntity {
  @PrimaryGeneratedColumn({ type: 'bigint', unsigned: true })
  id!: string;

  @Column({ type: 'int', unsigned: true, name: 'station_id' })
  stationId!: number;

  @ManyToOne(() => WeatherStationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'station_id', foreignKeyConstraintName: 'fk_daily_weather_station' })
  station?: WeatherStationEntity;

  /** Local calendar date "YYYY-MM-DD", kept as text so no time zone can shift it. */
  @Column({ type: 'char', length: 10 })
  date!: string;

  @Column({ type: 'double', name: 'eto_mm', nullable: true })
  etoMm!: number | null;

  @Column({ type: 'double', name: 'rain_mm', nullable: true })
  rainMm!: number | null;

  @Column({
    type: 'enum',
    enum: ['measured', 'penman-monteith', 'penman-monteith-estimated-rs', 'hargreaves', 'normal-filled'],
  })
  method!: DailyWeatherMethod;

  /** The observations ETo was computed from (JSON), when known. */
  @Column({ type: 'text', nullable: true })
  observations!: string | null;

  @Column({ type: 'enum', enum: ['upload', 'feed'] })
  source!: 'upload' | 'feed';

  @Column({ type: 'datetime', precision: 3, name: 'updated_at', default: () => 'CURRENT_TIMESTAMP(3)' })
  updatedAt!: Date;
}
