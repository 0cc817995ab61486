import express, { Router } from 'express';
import { z } from 'zod';
import {
  STATION_EXPOSURES,
  STATION_SOURCE_KINDS,
  WEATHER_STATION_LIMITS,
  WEATHER_STATION_SORTS,
  WEATHER_UPLOAD_FORMATS,
} from '@shared/weather/weather-station-dto';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, pageQuerySchema, validate } from '../../../platform/validation';
import type { DailyWeatherService } from '../domain/daily-weather-service';
import type { WeatherStationsService } from '../domain/weather-stations-service';

export const isoDate = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'must be a date YYYY-MM-DD')
  .refine(
    (d) => !Number.isNaN(Date.parse(d)) && new Date(Date.parse(d)).toISOString().startsWith(d),
    'is not a real date',
  );

const stationFields = {
  name: z
    .string()
    .trim()
    .min(1, 'is required')
    .max(WEATHER_STATION_LIMITS.nameMax, `must be at most ${WEATHER_STATION_LIMITS.nameMax} characters`),
  latitude: z.number().min(-90, 'must be −90..90°').max(90, 'must be −90..90°'),
  longitude: z.number().min(-180, 'must be −180..180°').max(180, 'must be −180..180°'),
  // Lowest dry land to above the highest stations (same bounds as the ETo engine): common practice, no source.
  elevationM: z.number().min(-450, 'must be −450..9000 m').max(9000, 'must be −450..9000 m'),
  windHeightM: z.number().min(0.5, 'must be 0.5..100 m').max(100, 'must be 0.5..100 m'),
  exposure: z.enum(STATION_EXPOSURES),
  sourceKind: z.enum(STATION_SOURCE_KINDS),
};
const createBody = z.strictObject({
  ...stationFields,
  windHeightM: stationFields.windHeightM.default(2),
  exposure: stationFields.exposure.default('interior'),
  sourceKind: stationFields.sourceKind.default('upload'),
});
const patchBody = z.strictObject(stationFields).partial();
const listQuery = pageQuerySchema(WEATHER_STATION_SORTS, 'name');
const rangeQuery = z.object({ from: isoDate, to: isoDate });
const uploadQuery = z.object({
  format: z.enum(WEATHER_UPLOAD_FORMATS, { message: `must be one of ${WEATHER_UPLOAD_FORMATS.join(', ')}` }),
});
// Monthly totals: ETo up to 20 mm/d for 31 days; rain up to 3 m in a month (screening bounds, common practice, no
// source).
const normalsBody = z.strictObject({
  normals: z.array(
    z.strictObject({
      month: z.number().int().min(1, 'must be 1–12').max(12, 'must be 1–12'),
      etoMm: z.number().min(0, 'must be 0..620 mm').max(620, 'must be 0..620 mm'),
      rainMm: z.number().min(0, 'must be 0..3000 mm').max(3000, 'must be 0..3000 mm'),
    }),
  ),
});

/** /api/weather-stations */
export function weatherStationsRouter(stations: WeatherStationsService, daily: DailyWeatherService): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    res.json(await stations.list(principalOf(req), validate(listQuery, req.query, 'Query')));
  });

  router.post('/', async (req, res) => {
    res.status(201).json(await stations.create(principalOf(req), validate(createBody, req.body, 'Weather station')));
  });

  router.get('/:id', async (req, res) => {
    res.json(await stations.get(principalOf(req), validate(idParam, req.params).id));
  });

  router.patch('/:id', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.json(await stations.update(principalOf(req), id, validate(patchBody, req.body, 'Weather station')));
  });

  router.get('/:id/daily', async (req, res) => {
    const { from, to } = validate(rangeQuery, req.query, 'Query');
    res.json(await daily.series(principalOf(req), validate(idParam, req.params).id, from, to));
  });

  // The file is the request body (text/csv), so no multipart parsing is needed for a few hundred kB.
  router.post(
    '/:id/daily',
    express.text({ type: ['text/csv', 'text/plain', 'application/csv'], limit: '5mb' }),
    async (req, res) => {
      const { id } = validate(idParam, req.params);
      const { format } = validate(uploadQuery, req.query, 'Query');
      const csv = typeof req.body === 'string' ? req.body : '';
      res.json(await daily.upload(principalOf(req), id, format, csv));
    },
  );

  router.post('/:id/fetch', async (req, res) => {
    const { id } = validate(idParam, req.params);
    const { from, to } = validate(z.strictObject({ from: isoDate, to: isoDate }), req.body, 'Fetch');
    res.json(await daily.fetchFromFeed(principalOf(req), id, from, to));
  });

  router.get('/:id/normals', async (req, res) => {
    res.json(await stations.normals(principalOf(req), validate(idParam, req.params).id));
  });

  router.put('/:id/normals', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.json(await stations.replaceNormals(principalOf(req), id, validate(normalsBody, req.body, 'Normals').normals));
  });

  return router;
}

/** /api/sites/:id/weather-station — which station a site takes its weather from. */
export function siteWeatherStationRouter(stations: WeatherStationsService): Router {
  const router = Router({ mergeParams: true });
  router.get('/', async (req, res) => {
    res.json({ station: await stations.stationOfSite(principalOf(req), validate(idParam, req.params).id) });
  });
  router.put('/', async (req, res) => {
    const { id } = validate(idParam, req.params);
    const { stationId } = validate(
      z.strictObject({ stationId: z.number().int().positive().nullable() }),
      req.body,
      'Link',
    );
    res.json({ station: await stations.linkSite(principalOf(req), id, stationId) });
  });
  return router;
}
