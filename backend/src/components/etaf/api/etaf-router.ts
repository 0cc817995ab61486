import { Router } from 'express';
import { z } from 'zod';
import { ETAF_BASES, ETAF_SORTS } from '@shared/etaf/etaf-dto';
import { SITE_KINDS } from '@shared/sites/site';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, pageQuerySchema, validate } from '../../../platform/validation';
import type { EtafService } from '../domain/etaf-service';

const month = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'must be a month YYYY-MM');
const periodQuery = z.object({ from: month.optional(), to: month.optional() });
const reportQuery = pageQuerySchema(ETAF_SORTS, 'rank').extend({
  ...periodQuery.shape,
  kind: z.enum(SITE_KINDS, { message: `must be one of ${SITE_KINDS.join(', ')}` }).optional(),
  tag: z.string().trim().min(1).max(40).optional(),
});
const settingBody = z.strictObject({
  allowedEtaf: z.number().gt(0, 'must be above 0').max(1, 'must be at most 1'),
  basis: z.enum(ETAF_BASES, { message: `must be one of ${ETAF_BASES.join(', ')}` }),
});

/** /api/etaf (the ranking) */
export function etafRouter(etaf: EtafService): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json(await etaf.report(principalOf(req), validate(reportQuery, req.query, 'Query')));
  });
  return router;
}

/** /api/sites/:id/etaf (the site's standing) and /api/sites/:id/etaf-setting */
export function siteEtafRouter(etaf: EtafService): Router {
  const router = Router({ mergeParams: true });
  router.get('/etaf', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.json(await etaf.standing(principalOf(req), id, validate(periodQuery, req.query, 'Query')));
  });
  router.get('/etaf-setting', async (req, res) => {
    res.json(await etaf.setting(principalOf(req), validate(idParam, req.params).id));
  });
  router.put('/etaf-setting', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.json(await etaf.saveSetting(principalOf(req), id, validate(settingBody, req.body, 'ETAF setting')));
  });
  return router;
}
