import { Router } from 'express';
import { z } from 'zod';
import { ALERT_RESOLUTIONS, ALERT_SORTS, ALERT_STATUSES, NOTIFICATION_FREQUENCIES } from '@shared/alerts/alert-dto';
import { FINDING_KINDS } from '@shared/watch/finding';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, validate } from '../../../platform/validation';
import type { AlertsService } from '../domain/alerts-service';

const listQuery = z.object({
  status: z.enum(ALERT_STATUSES).optional(),
  kind: z.enum(FINDING_KINDS).optional(),
  siteId: z.coerce.number().int().positive().optional(),
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
  sort: z.enum(ALERT_SORTS).default('detected'),
  dir: z.enum(['asc', 'desc']).default('desc'),
});
const note = z.string().trim().max(2000, 'must be at most 2000 characters');
const actionBody = z.strictObject({ note: note.optional() });
const noteBody = z.strictObject({ note: note.min(1, 'is required') });
const day = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, 'must be a date YYYY-MM-DD');
const resolveBody = z.strictObject({
  note: note.optional(),
  resolution: z.enum(ALERT_RESOLUTIONS, { message: `must be one of ${ALERT_RESOLUTIONS.join(', ')}` }).optional(),
  repairedOn: day.optional(),
});
const repairTimesQuery = z.object({ from: day, to: day });
const preferenceBody = z.strictObject({
  frequency: z.enum(NOTIFICATION_FREQUENCIES),
  siteIds: z.array(z.number().int().positive()).max(5000).nullable(),
});

/** /api/alerts */
export function alertsRouter(alerts: AlertsService): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json(await alerts.list(principalOf(req), validate(listQuery, req.query, 'Query')));
  });
  router.get('/repair-times', async (req, res) => {
    const q = validate(repairTimesQuery, req.query, 'Query');
    res.json(await alerts.repairTimes(principalOf(req), q.from, q.to));
  });
  router.get('/:id', async (req, res) => {
    res.json(await alerts.get(principalOf(req), validate(idParam, req.params).id));
  });
  router.post('/:id/acknowledge', async (req, res) => {
    res.json(
      await alerts.acknowledge(
        principalOf(req),
        validate(idParam, req.params).id,
        validate(actionBody, req.body ?? {}, 'Acknowledgement').note,
      ),
    );
  });
  router.post('/:id/resolve', async (req, res) => {
    res.json(
      await alerts.resolve(
        principalOf(req),
        validate(idParam, req.params).id,
        validate(resolveBody, req.body ?? {}, 'Resolution'),
      ),
    );
  });
  router.post('/:id/notes', async (req, res) => {
    res
      .status(201)
      .json(
        await alerts.addNote(
          principalOf(req),
          validate(idParam, req.params).id,
          validate(noteBody, req.body, 'Note').note,
        ),
      );
  });
  return router;
}

/** /api/me/notifications: the signed-in user's own watch e-mail preference. */
export function notificationsRouter(alerts: AlertsService): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json(await alerts.notificationPreference(principalOf(req)));
  });
  router.put('/', async (req, res) => {
    res.json(
      await alerts.setNotificationPreference(
        principalOf(req),
        validate(preferenceBody, req.body, 'Notification preference'),
      ),
    );
  });
  return router;
}
