import { Router } from 'express';
import { z } from 'zod';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, validate } from '../../../platform/validation';
import type { ApiKeysService } from '../domain/api-keys-service';

const body = z.strictObject({
  name: z.string().trim().min(1, 'is required').max(120),
  siteIds: z
    .array(z.number().int().positive())
    .min(1, 'choose at least one site')
    .max(500)
    .transform((ids) => [...new Set(ids)]),
});

/** /api/api-keys (administrators) */
export function apiKeysRouter(keys: ApiKeysService): Router {
  const router = Router();
  router.get('/api-keys', async (req, res) => {
    res.json(await keys.list(principalOf(req)));
  });
  router.post('/api-keys', async (req, res) => {
    const { name, siteIds } = validate(body, req.body, 'API key');
    res.status(201).json(await keys.create(principalOf(req), name, siteIds));
  });
  router.delete('/api-keys/:id', async (req, res) => {
    await keys.revoke(principalOf(req), validate(idParam, req.params).id);
    res.status(204).end();
  });
  return router;
}
