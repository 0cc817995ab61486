import { Router } from 'express';
import { z } from 'zod';
import { IRRIGATION_METHODS } from '@shared/budgets/hydrozone';
import { PLAN_LIMITS as L, PLAN_SORTS } from '@shared/planner/plan-dto';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, pageQuerySchema, validate } from '../../../platform/validation';
import { sendFile } from '../../../platform/send-file';
import type { PlanCarryOut } from '../domain/plan-carry-out';
import type { PlanComparisonService } from '../domain/plan-comparison-service';
import { planPdf } from '../domain/plan-pdf';
import type { PlansService } from '../domain/plans-service';

const month = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'must be a month YYYY-MM');
const zoneChange = z.strictObject({
  hydrozoneId: z.number().int().positive(),
  irrigationMethod: z.enum(IRRIGATION_METHODS).nullable().optional(),
  plantFactor: z.number().min(0, 'must be 0–1').max(1, 'must be 0–1').nullable().optional(),
  areaRemovedFt2: z.number().min(0, 'must be zero or more').nullable().optional(),
  efficiency: z.number().gt(0, 'must be above 0').max(1, 'must be at most 1').nullable().optional(),
});
const planFields = {
  title: z.string().trim().min(1, 'is required').max(L.titleMax, `must be at most ${L.titleMax} characters`),
  notes: z.string().max(L.notesMax).optional(),
  weatherYear: z.number().int().min(2000, 'must be 2000 or later').max(2100, 'must be 2100 or earlier'),
  costOfWork: z.number().min(0, 'must be zero or more').max(L.costMax),
  currency: z.string().regex(/^[A-Z]{3}$/, 'must be a three-letter code such as USD'),
  smartControllerReductionPercent: z.number().min(0, 'must be 0–99').max(99, 'must be 0–99').nullable().optional(),
  rainSensor: z.boolean().optional(),
  zoneChanges: z.array(zoneChange).max(L.zoneChangesMax),
};
const createBody = z.strictObject({ ...planFields, currency: planFields.currency.default('USD') });
const patchBody = z.strictObject(planFields).partial();
const carryOutBody = z.strictObject({
  installedOn: z.iso.date('must be a date YYYY-MM-DD'),
  baselineFrom: month.optional(),
  baselineTo: month.optional(),
  reportingFrom: month.optional(),
  reportingTo: month.optional(),
});
const listQuery = pageQuerySchema(PLAN_SORTS, 'updatedAt');

/** /api/sites/:id/plans */
export function sitePlansRouter(plans: PlansService): Router {
  const router = Router({ mergeParams: true });
  router.get('/', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.json(await plans.list(principalOf(req), id, validate(listQuery, req.query, 'Query')));
  });
  router.post('/', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.status(201).json(await plans.create(principalOf(req), id, validate(createBody, req.body, 'Plan')));
  });
  return router;
}

/** /api/plans/:id, its comparison (JSON and PDF) and carry-out */
export function plansRouter(plans: PlansService, comparison: PlanComparisonService, carryOut: PlanCarryOut): Router {
  const router = Router();
  router.get('/:id', async (req, res) => {
    res.json(await plans.get(principalOf(req), validate(idParam, req.params).id));
  });
  router.patch('/:id', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.json(await plans.update(principalOf(req), id, validate(patchBody, req.body, 'Plan')));
  });
  router.delete('/:id', async (req, res) => {
    await plans.remove(principalOf(req), validate(idParam, req.params).id);
    res.status(204).end();
  });
  router.get('/:id/comparison', async (req, res) => {
    res.json(await comparison.compare(principalOf(req), validate(idParam, req.params).id));
  });
  router.get('/:id/comparison.pdf', async (req, res) => {
    const { id } = validate(idParam, req.params);
    const principal = principalOf(req);
    const pdf = await planPdf(await plans.get(principal, id), await comparison.compare(principal, id));
    sendFile(res, pdf, 'application/pdf', `plan-${id}.pdf`);
  });
  router.post('/:id/carry-out', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.status(201).json(await carryOut.carryOut(principalOf(req), id, validate(carryOutBody, req.body, 'Carry out')));
  });
  return router;
}
