import { Router } from 'express';
import { z } from 'zod';
import { RAIN_CREDIT_KINDS } from '@shared/budgets/budget-dto';
import { principalOf } from '../../../platform/auth/guards';
import { validate } from '../../../platform/validation';
import type { BudgetsService } from '../domain/budgets-service';

const month = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'must be a month YYYY-MM');
const siteParam = z.object({ id: z.coerce.number().int().positive() });
const budgetQuery = z
  .object({
    from: month,
    to: month,
    rain: z.enum(RAIN_CREDIT_KINDS, { message: `must be one of ${RAIN_CREDIT_KINDS.join(', ')}` }).default('none'),
    rainValue: z.coerce.number().min(0, 'must be zero or more').optional(),
    // Indoor allotment for a mixed meter: both or neither.
    occupants: z.coerce
      .number()
      .int('must be a whole number')
      .min(0, 'must be zero or more')
      .max(100_000, 'must be at most 100,000')
      .optional(),
    gallonsPerPersonPerDay: z.coerce
      .number()
      .min(0, 'must be zero or more')
      .max(500, 'must be at most 500 gal')
      .optional(),
  })
  .refine((q) => q.rain !== 'fixed-fraction' || q.rainValue === undefined || q.rainValue <= 1, {
    message: 'a rain fraction must be 0..1',
    path: ['rainValue'],
  })
  .refine((q) => (q.occupants === undefined) === (q.gallonsPerPersonPerDay === undefined), {
    message: 'give occupants and gallonsPerPersonPerDay together',
    path: ['occupants'],
  });
const complianceQuery = z.object({
  year: z.coerce.number().int().min(2000, 'must be 2000 or later').max(2100, 'must be 2100 or earlier'),
  projectType: z.enum(['residential', 'non-residential']).optional(),
  effectivePrecipitation: z
    .enum(['true', 'false'])
    .default('false')
    .transform((v) => v === 'true'),
});
const adviceParams = z.object({ id: z.coerce.number().int().positive(), zoneId: z.coerce.number().int().positive() });
const previousMonth = () => {
  const now = new Date();
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 1, 1)).toISOString().slice(0, 7);
};
const adviceQuery = z.object({
  month: month.optional(),
  daysPerWeek: z.coerce.number().int('must be a whole number').min(1, 'must be 1–7').max(7, 'must be 1–7').default(3),
});

/** /api/sites/:id/budget, /compliance and /hydrozones/:zoneId/advice */
export function budgetsRouter(budgets: BudgetsService): Router {
  const router = Router({ mergeParams: true });

  router.get('/budget', async (req, res) => {
    const { id } = validate(siteParam, req.params);
    const q = validate(budgetQuery, req.query, 'Query');
    const indoor =
      q.occupants !== undefined && q.gallonsPerPersonPerDay !== undefined
        ? { occupants: q.occupants, gallonsPerPersonPerDay: q.gallonsPerPersonPerDay }
        : undefined;
    res.json(await budgets.budget(principalOf(req), id, q.from, q.to, q.rain, q.rainValue, indoor));
  });

  router.get('/compliance', async (req, res) => {
    const { id } = validate(siteParam, req.params);
    const q = validate(complianceQuery, req.query, 'Query');
    res.json(await budgets.compliance(principalOf(req), id, q.year, q.projectType, q.effectivePrecipitation));
  });

  router.get('/hydrozones/:zoneId/advice', async (req, res) => {
    const { id, zoneId } = validate(adviceParams, req.params);
    const q = validate(adviceQuery, req.query, 'Query');
    res.json(await budgets.advice(principalOf(req), id, zoneId, q.month ?? previousMonth(), q.daysPerWeek));
  });

  return router;
}
