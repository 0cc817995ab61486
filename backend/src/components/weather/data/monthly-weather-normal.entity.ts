import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { WeatherStationEntity } from './weather-station.entity';

/** Long-term monthly totals of a station, used for months not yet measured and to fill gaps. */
@Entity({ name: 'monthly_weather_normal' })
export class MonthlyWeatherNormalEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'station_id' })
  stationId!: number;

  @PrimaryColumn({ type: 'tinyint', unsigned: true })
  month!: number;

  @ManyToOne(() => WeatherStationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'station_id', foreignKeyConstraintName: 'fk_monthly_normal_station' })
  station?: WeatherStationEntity;

  @Column({ type: 'double', name: 'eto_mm' })
  etoMm!: number;

  @Column({ type: 'double', name: 'rain_mm' })
  rainMm!: number;
}
