import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { Config } from '../../config';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { SitesService } from '../sites/domain/sites-service';
import { siteWeatherStationRouter, weatherStationsRouter } from './api/weather-stations-router';
import { WeatherFeedClient } from './data/weather-feed-client';
import { WeatherRepository } from './data/weather-repository';
import { DailyWeatherService } from './domain/daily-weather-service';
import { WeatherStationsService } from './domain/weather-stations-service';

export interface Weather {
  stations: WeatherStationsService;
  daily: DailyWeatherService;
  /** /sites/:id/weather-station and /weather-stations */
  router: Router;
}

/** Wires weather stations, their daily weather and monthly normals, and the weather feed. */
export function createWeather(deps: {
  db: DataSource;
  config: Config;
  sites: SitesService;
  audit: AuditRepository;
}): Weather {
  const { db, config, sites, audit } = deps;
  const repository = new WeatherRepository(db);
  const stations = new WeatherStationsService(db, repository, sites, audit);
  const feed = new WeatherFeedClient(config.weather.feedUrl, config.weather.feedTimeoutMs);
  const daily = new DailyWeatherService(db, repository, stations, feed, audit);
  const router = Router();
  router.use('/sites/:id/weather-station', siteWeatherStationRouter(stations));
  router.use('/weather-stations', weatherStationsRouter(stations, daily));
  return { stations, daily, router };
}
