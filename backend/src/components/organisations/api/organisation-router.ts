import { Router } from 'express';
import { z } from 'zod';
import { UNIT_SYSTEMS } from '@shared/budgets/budget-dto';
import { DATE_ORDERS } from '@shared/ingest/date-order';
import { principalOf } from '../../../platform/auth/guards';
import { validate } from '../../../platform/validation';
import type { OrganisationSettingsService } from '../domain/organisation-settings-service';

const settingsBody = z
  .strictObject({
    unitSystem: z.enum(UNIT_SYSTEMS, { message: 'must be us or metric' }),
    dateOrder: z.enum(DATE_ORDERS, { message: 'must be month-first or day-first' }).nullable(),
  })
  .partial();

/** /api/organisation */
export function organisationRouter(settings: OrganisationSettingsService): Router {
  const router = Router();
  router.get('/settings', async (req, res) => {
    res.json(await settings.get(principalOf(req)));
  });
  router.patch('/settings', async (req, res) => {
    res.json(await settings.update(principalOf(req), validate(settingsBody, req.body, 'Settings')));
  });
  return router;
}
