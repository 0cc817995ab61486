import { Router } from 'express';
import { z } from 'zod';
import { METER_PURPOSES, WATER_SOURCES } from '@shared/meters/meter';
import { VOLUME_UNITS } from '@shared/units/volume-units';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, validate } from '../../../platform/validation';
import type { MetersService } from '../domain/meters-service';

const ref = z.string().trim().min(1, 'is required').max(64, 'must be at most 64 characters');
const instant = z.iso.datetime({ offset: true, message: 'must be an ISO 8601 instant' });
const meterFields = {
  ref,
  unit: z.enum(VOLUME_UNITS),
  registerMultiplier: z.number().positive().default(1),
  registerDigits: z.number().int().min(1).max(12).nullable().default(null),
  purpose: z.enum(METER_PURPOSES),
  waterSource: z.enum(WATER_SOURCES),
  installedAt: instant.nullable().default(null),
  removedAt: instant.nullable().default(null),
  previousRegisters: z
    .array(
      z.strictObject({
        installedAt: instant,
        removedAt: instant,
        multiplier: z.number().positive(),
        digits: z.number().int().min(1).max(12).nullable(),
      }),
    )
    .max(20)
    .default([]),
};
const meterBody = z.strictObject(meterFields);
const meterPatch = z
  .strictObject({
    ref,
    unit: meterFields.unit,
    registerMultiplier: z.number().positive(),
    registerDigits: z.number().int().min(1).max(12).nullable(),
    purpose: meterFields.purpose,
    waterSource: meterFields.waterSource,
    installedAt: instant.nullable(),
    removedAt: instant.nullable(),
    previousRegisters: meterFields.previousRegisters,
  })
  .partial();
const zoneBody = z.strictObject({
  station: z.string().trim().min(1, 'is required').max(16),
  name: z.string().trim().min(1, 'is required').max(120),
  hydrozoneId: z.number().int().positive().nullable().default(null),
  designGpm: z.number().positive().nullable().default(null),
  emitterCount: z.number().int().positive().nullable().default(null),
  emitterGph: z.number().positive().nullable().default(null),
});
const controllerBody = z.strictObject({
  ref,
  name: z.string().trim().min(1, 'is required').max(120),
  zones: z.array(zoneBody).max(200).optional(),
});
const swapBody = z.strictObject({
  swappedAt: instant,
  multiplier: z.number().positive().default(1),
  digits: z.number().int().min(1).max(12).nullable().default(null),
});
const meterParams = z.object({ id: z.coerce.number().int().positive(), meterId: z.coerce.number().int().positive() });
const zonePatch = z
  .strictObject({
    station: zoneBody.shape.station,
    name: zoneBody.shape.name,
    hydrozoneId: z.number().int().positive().nullable(),
    designGpm: z.number().positive().nullable(),
    emitterCount: z.number().int().positive().nullable(),
    emitterGph: z.number().positive().nullable(),
  })
  .partial();
const controllerParams = z.object({
  id: z.coerce.number().int().positive(),
  controllerId: z.coerce.number().int().positive(),
});
const zoneParams = controllerParams.extend({ zoneId: z.coerce.number().int().positive() });

/** /api/sites/:id/meters and /api/sites/:id/controllers */
export function metersRouter(meters: MetersService): Router {
  const router = Router();

  router.get('/sites/:id/meters', async (req, res) => {
    res.json(await meters.meters(principalOf(req), validate(idParam, req.params).id));
  });
  router.post('/sites/:id/meters', async (req, res) => {
    res
      .status(201)
      .json(
        await meters.createMeter(
          principalOf(req),
          validate(idParam, req.params).id,
          validate(meterBody, req.body, 'Meter'),
        ),
      );
  });
  router.patch('/sites/:id/meters/:meterId', async (req, res) => {
    const { id, meterId } = validate(meterParams, req.params);
    res.json(await meters.updateMeter(principalOf(req), id, meterId, validate(meterPatch, req.body, 'Meter')));
  });
  router.post('/sites/:id/meters/:meterId/swaps', async (req, res) => {
    const { id, meterId } = validate(meterParams, req.params);
    res.status(201).json(await meters.recordSwap(principalOf(req), id, meterId, validate(swapBody, req.body, 'Swap')));
  });
  router.delete('/sites/:id/meters/:meterId', async (req, res) => {
    const { id, meterId } = validate(meterParams, req.params);
    await meters.deleteMeter(principalOf(req), id, meterId);
    res.status(204).end();
  });

  router.get('/sites/:id/controllers', async (req, res) => {
    res.json(await meters.controllers(principalOf(req), validate(idParam, req.params).id));
  });
  router.post('/sites/:id/controllers', async (req, res) => {
    res
      .status(201)
      .json(
        await meters.createController(
          principalOf(req),
          validate(idParam, req.params).id,
          validate(controllerBody, req.body, 'Controller'),
        ),
      );
  });
  router.post('/sites/:id/controllers/:controllerId/zones', async (req, res) => {
    const { id, controllerId } = validate(controllerParams, req.params);
    res
      .status(201)
      .json(await meters.addZone(principalOf(req), id, controllerId, validate(zoneBody, req.body, 'Zone')));
  });
  router.patch('/sites/:id/controllers/:controllerId/zones/:zoneId', async (req, res) => {
    const { id, controllerId, zoneId } = validate(zoneParams, req.params);
    res.json(
      await meters.updateZone(principalOf(req), id, controllerId, zoneId, validate(zonePatch, req.body, 'Zone')),
    );
  });

  return router;
}
