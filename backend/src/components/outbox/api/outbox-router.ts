import { Router } from 'express';
import type { Config } from '../../../config';
import { requireCapability } from '../../../platform/auth/guards';
import { fetchOutbox } from '../../../platform/mail/outbox-client';

/** GET /api/dev/outbox: what the local fake SMTP server received (development only, administrators). */
export function outboxRouter(config: Config): Router {
  const router = Router();
  router.get('/', requireCapability('viewOutbox'), async (_req, res) => {
    res.json({ messages: await fetchOutbox(config.mail) });
  });
  return router;
}
