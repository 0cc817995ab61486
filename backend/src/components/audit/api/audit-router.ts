import { Router } from 'express';
import { z } from 'zod';
import { principalOf, requireCapability } from '../../../platform/auth/guards';
import { validate } from '../../../platform/validation';
import type { AuditRepository } from '../data/audit-repository';

const query = z.object({
  entity: z.string().max(40).optional(),
  entityId: z.string().max(40).optional(),
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});

/** GET /api/audit: who changed what in the administrator's organisation. */
export function auditRouter(audit: AuditRepository): Router {
  const router = Router();
  router.get('/', requireCapability('manageSettings'), async (req, res) => {
    res.json(await audit.list(principalOf(req).organisationId, validate(query, req.query, 'Query')));
  });
  return router;
}
