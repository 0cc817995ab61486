import { Router } from 'express';
import { z } from 'zod';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, validate } from '../../../platform/validation';
import type { ImportProfilesService } from '../domain/import-profiles-service';
import { mappingSchema } from './mapping-schema';

const body = z.strictObject({ name: z.string().trim().min(1, 'is required').max(120), mapping: mappingSchema });

/** /api/import-profiles */
export function importProfilesRouter(profiles: ImportProfilesService): Router {
  const router = Router();
  router.get('/import-profiles', async (req, res) => {
    res.json(await profiles.list(principalOf(req)));
  });
  router.post('/import-profiles', async (req, res) => {
    const { name, mapping } = validate(body, req.body, 'Import profile');
    res.status(201).json(await profiles.create(principalOf(req), name, mapping));
  });
  router.delete('/import-profiles/:id', async (req, res) => {
    await profiles.remove(principalOf(req), validate(idParam, req.params).id);
    res.status(204).end();
  });
  return router;
}
