import { Router } from 'express';
import { z } from 'zod';
import { BILLING_UNITS } from '@shared/rates/rate-schedule';
import { RATE_SCHEDULE_LIMITS } from '@shared/rates/rate-schedule-dto';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, validate } from '../../../platform/validation';
import { isoDate } from '../../weather/api/weather-stations-router';
import type { RateSchedulesService } from '../domain/rate-schedules-service';

const price = z
  .number({ message: 'must be a number' })
  .min(0, 'must be zero or more')
  .max(10_000, 'must be at most 10,000');
const bound = z.number({ message: 'must be a number' }).positive('must be greater than 0').nullable();
const tiers = <T extends z.ZodRawShape>(shape: T) =>
  z
    .array(z.strictObject(shape))
    .min(1, 'needs at least one tier')
    .max(RATE_SCHEDULE_LIMITS.tiersMax, `at most ${RATE_SCHEDULE_LIMITS.tiersMax} tiers`);
const volumeCharge = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('uniform'), pricePerUnit: price }),
  z.strictObject({ kind: z.literal('tiered'), tiers: tiers({ upToUnits: bound, pricePerUnit: price }) }),
  z.strictObject({
    kind: z.literal('budget-based'),
    tiers: tiers({ upToPercentOfBudget: bound, pricePerUnit: price }),
  }),
]);
const fields = {
  name: z
    .string()
    .trim()
    .min(1, 'is required')
    .max(RATE_SCHEDULE_LIMITS.nameMax, `must be at most ${RATE_SCHEDULE_LIMITS.nameMax} characters`),
  unit: z.enum(BILLING_UNITS, { message: 'must be ccf or kgal' }),
  currency: z.string().regex(RATE_SCHEDULE_LIMITS.currencyPattern, 'must be a three-letter currency code such as USD'),
  fixedChargePerPeriod: price,
  volumeCharge,
  effectiveFrom: isoDate,
};
const createBody = z.strictObject({ ...fields, currency: fields.currency.default('USD') });
const patchBody = z.strictObject(fields).partial();
const scheduleParams = z.object({
  id: z.coerce.number().int().positive(),
  scheduleId: z.coerce.number().int().positive(),
});

/** /api/sites/:id/rate-schedules */
export function rateSchedulesRouter(rates: RateSchedulesService): Router {
  const router = Router({ mergeParams: true });

  router.get('/', async (req, res) => {
    res.json(await rates.list(principalOf(req), validate(idParam, req.params).id));
  });

  router.post('/', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.status(201).json(await rates.create(principalOf(req), id, validate(createBody, req.body, 'Rate schedule')));
  });

  router.patch('/:scheduleId', async (req, res) => {
    const { id, scheduleId } = validate(scheduleParams, req.params);
    res.json(await rates.update(principalOf(req), id, scheduleId, validate(patchBody, req.body, 'Rate schedule')));
  });

  router.delete('/:scheduleId', async (req, res) => {
    const { id, scheduleId } = validate(scheduleParams, req.params);
    await rates.remove(principalOf(req), id, scheduleId);
    res.status(204).end();
  });

  return router;
}
