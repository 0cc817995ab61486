import { Router } from 'express';
import { z } from 'zod';
import { IRRIGATION_METHODS, PLANT_WATER_USE_CATEGORIES } from '@shared/budgets/hydrozone';
import {
  HYDROZONE_AREA_UNITS,
  HYDROZONE_LIMITS,
  HYDROZONE_SORTS,
  SPECIAL_LANDSCAPE_KINDS,
} from '@shared/hydrozones/hydrozone-dto';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, pageQuerySchema, validate } from '../../../platform/validation';
import type { HydrozonesService } from '../domain/hydrozones-service';

const L = HYDROZONE_LIMITS;
const optionalNumber = (schema: z.ZodNumber) => schema.nullable().optional();
// Ranges the engine checks with fuller messages (plant factor within its category, efficiency in (0, 1]) are left to
// it.
const fields = {
  name: z.string().trim().min(1, 'is required').max(L.nameMax, `must be at most ${L.nameMax} characters`),
  area: z
    .number({ message: 'must be a number' })
    .positive('must be greater than 0')
    .max(L.areaMaxFt2, `must be at most ${L.areaMaxFt2.toLocaleString('en-US')}`),
  areaUnit: z.enum(HYDROZONE_AREA_UNITS, { message: 'must be ft2 or m2' }),
  plantWaterUse: z
    .enum(PLANT_WATER_USE_CATEGORIES, { message: `must be one of ${PLANT_WATER_USE_CATEGORIES.join(', ')}` })
    .nullable()
    .optional(),
  plantFactor: optionalNumber(z.number({ message: 'must be a number' })),
  irrigationMethod: z.enum(IRRIGATION_METHODS, { message: `must be one of ${IRRIGATION_METHODS.join(', ')}` }),
  efficiencyOverride: optionalNumber(z.number({ message: 'must be a number' })),
  specialLandscapeArea: z.boolean().optional(),
  specialLandscapeKind: z
    .enum(SPECIAL_LANDSCAPE_KINDS, { message: `must be one of ${SPECIAL_LANDSCAPE_KINDS.join(', ')}` })
    .nullable()
    .optional(),
  designFlowGpm: optionalNumber(
    z.number().positive('must be greater than 0 gpm').max(L.flowMaxGpm, `must be at most ${L.flowMaxGpm} gpm`),
  ),
  emitterCount: optionalNumber(
    z
      .number()
      .int('must be a whole number')
      .positive('must be at least 1')
      .max(L.emitterCountMax, `must be at most ${L.emitterCountMax}`),
  ),
  emitterGph: optionalNumber(
    z.number().positive('must be greater than 0 gph').max(L.emitterGphMax, `must be at most ${L.emitterGphMax} gph`),
  ),
  soilIntakeInPerHour: optionalNumber(
    z
      .number()
      .positive('must be greater than 0 in/h')
      .max(L.soilIntakeMaxInPerHour, `must be at most ${L.soilIntakeMaxInPerHour} in/h`),
  ),
  notes: z.string().max(L.notesMax, `must be at most ${L.notesMax} characters`).optional(),
};
const createBody = z.strictObject(fields);
const patchBody = z.strictObject(fields).partial();
const listQuery = pageQuerySchema(HYDROZONE_SORTS, 'name');
const zoneParams = z.object({ id: z.coerce.number().int().positive(), zoneId: z.coerce.number().int().positive() });

/** /api/sites/:id/hydrozones */
export function hydrozonesRouter(zones: HydrozonesService): Router {
  const router = Router({ mergeParams: true });

  router.get('/', async (req, res) => {
    res.json(
      await zones.list(principalOf(req), validate(idParam, req.params).id, validate(listQuery, req.query, 'Query')),
    );
  });

  router.post('/', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.status(201).json(await zones.create(principalOf(req), id, validate(createBody, req.body, 'Hydrozone')));
  });

  router.get('/:zoneId', async (req, res) => {
    const { id, zoneId } = validate(zoneParams, req.params);
    res.json(await zones.get(principalOf(req), id, zoneId));
  });

  router.patch('/:zoneId', async (req, res) => {
    const { id, zoneId } = validate(zoneParams, req.params);
    res.json(await zones.update(principalOf(req), id, zoneId, validate(patchBody, req.body, 'Hydrozone')));
  });

  router.delete('/:zoneId', async (req, res) => {
    const { id, zoneId } = validate(zoneParams, req.params);
    await zones.remove(principalOf(req), id, zoneId);
    res.status(204).end();
  });

  return router;
}
