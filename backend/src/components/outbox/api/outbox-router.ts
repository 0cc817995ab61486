import { Router } from 'express';
import type { Config } from '../../../config';
import { principalOf, requireCapability } from '../../../platform/auth/guards';
import { fetchOutbox } from '../../../platform/mail/outbox-client';

/**
 * GET /api/dev/outbox: what the local fake SMTP server received (development only, administrators). Mounted only
 * when RILLMARK_DEV_OUTBOX=true, which the configuration refuses with NODE_ENV=production. An administrator sees only
 * messages sent for their own organisation (invitations and resets it sent, alerts and notices about its sites):
 * another organisation's invitation links or reset tokens never show.
 */
export function outboxRouter(config: Config): Router {
  const router = Router();
  router.get('/', requireCapability('viewOutbox'), async (req, res) => {
    const { organisationId } = principalOf(req);
    const messages = (await fetchOutbox(config.mail)).filter((m) => m.organisationIds.includes(organisationId));
    res.json({ messages });
  });
  return router;
}
