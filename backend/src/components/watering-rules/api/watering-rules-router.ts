import { Router } from 'express';
import { z } from 'zod';
import { RULE_SORTS } from '@shared/watering-rules/rules-dto';
import { DAY_MODES } from '@shared/watering-rules/watering-rule';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, pageQuerySchema, validate } from '../../../platform/validation';
import type { WateringRulesService } from '../domain/watering-rules-service';

const date = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, 'must be a date YYYY-MM-DD');
const hour = z.number().int().min(0, 'must be 0–23').max(23, 'must be 0–23');
const weekdays = z.array(z.number().int().min(0).max(6)).max(7);
const ruleBody = z.strictObject({
  name: z.string().trim().min(1, 'is required').max(120),
  stage: z.string().trim().min(1, 'is required').max(60),
  dayMode: z.enum(DAY_MODES, { message: `must be one of ${DAY_MODES.join(', ')}` }),
  weekdays: weekdays.default([]),
  allowedHours: z.strictObject({ startHour: hour, endHour: hour }),
  maxStationMinutes: z.number().int().min(1).max(600).nullable(),
  inForceFrom: date,
  inForceTo: date.nullable(),
  sites: z
    .array(
      z.strictObject({
        siteId: z.number().int().positive(),
        addressNumber: z.number().int().min(0).max(999_999_999).nullable().default(null),
        assignedWeekdays: weekdays.default([]),
      }),
    )
    .max(5000)
    .default([]),
});
const listQuery = pageQuerySchema(RULE_SORTS, 'from');
const worklistQuery = z.object({
  month: z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'must be a month YYYY-MM'),
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});

/** /api/watering-rules: an agency's rules by stage, and its worklist of sites watering outside them. */
export function wateringRulesRouter(rules: WateringRulesService): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json(await rules.list(principalOf(req), validate(listQuery, req.query, 'Query')));
  });
  router.get('/worklist', async (req, res) => {
    res.json(await rules.worklist(principalOf(req), validate(worklistQuery, req.query, 'Query')));
  });
  router.post('/', async (req, res) => {
    res.status(201).json(await rules.create(principalOf(req), validate(ruleBody, req.body, 'Watering rule')));
  });
  router.get('/:id', async (req, res) => {
    res.json(await rules.get(principalOf(req), validate(idParam, req.params).id));
  });
  router.put('/:id', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.json(await rules.update(principalOf(req), id, validate(ruleBody, req.body, 'Watering rule')));
  });
  router.delete('/:id', async (req, res) => {
    await rules.remove(principalOf(req), validate(idParam, req.params).id);
    res.status(204).end();
  });
  return router;
}
