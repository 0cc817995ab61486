import { Router } from 'express';
import { z } from 'zod';
import { BOARD_PACKET_MAX_SITES, MONTH_CLOSE_SORTS } from '@shared/month-close/month-close-dto';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, pageQuerySchema, validate } from '../../../platform/validation';
import type { BoardPacketService } from '../domain/board-packet-service';
import type { MonthCloseService } from '../domain/month-close-service';

const month = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'must be a month YYYY-MM');
const tableQuery = pageQuerySchema(MONTH_CLOSE_SORTS, 'name').extend({
  month,
  tag: z.string().trim().min(1).max(40).optional(),
});
const packetsQuery = pageQuerySchema(['createdAt'], 'createdAt').extend({ month: month.optional() });
const packetBody = z.strictObject({
  month,
  title: z.string().trim().min(1, 'is required').max(160, 'must be at most 160 characters'),
  siteIds: z
    .array(z.number().int().positive())
    .min(1, 'choose at least one site')
    .max(BOARD_PACKET_MAX_SITES, `at most ${BOARD_PACKET_MAX_SITES} sites in one packet`),
});
const reviewParams = z.object({ id: z.coerce.number().int().positive(), month });
const reviewBody = z.strictObject({
  note: z.string().trim().max(2000, 'must be at most 2,000 characters').default(''),
});

/** /api/month-close: the organisation's month, and its board packets. */
export function monthCloseRouter(monthClose: MonthCloseService, packets: BoardPacketService): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json(await monthClose.table(principalOf(req), validate(tableQuery, req.query, 'Query')));
  });
  router.get('/packets', async (req, res) => {
    res.json(await packets.list(principalOf(req), validate(packetsQuery, req.query, 'Query')));
  });
  router.post('/packets', async (req, res) => {
    res.status(202).json(await packets.start(principalOf(req), validate(packetBody, req.body, 'Board packet')));
  });
  router.get('/packets/:id', async (req, res) => {
    res.json(await packets.get(principalOf(req), validate(idParam, req.params).id));
  });
  router.get('/packets/:id/file', async (req, res) => {
    const file = await packets.file(principalOf(req), validate(idParam, req.params).id);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
    res.setHeader('Cache-Control', 'no-store');
    if (file.sizeBytes) res.setHeader('Content-Length', String(file.sizeBytes));
    file.stream.on('error', () => res.destroy());
    file.stream.pipe(res);
  });
  return router;
}

/** /api/sites/:id/month-reviews/:month: a manager's review mark on one site's month. */
export function monthReviewsRouter(monthClose: MonthCloseService): Router {
  const router = Router({ mergeParams: true });
  router.put('/:month', async (req, res) => {
    const { id, month: m } = validate(reviewParams, req.params);
    res.json(await monthClose.markReviewed(principalOf(req), id, m, validate(reviewBody, req.body, 'Review').note));
  });
  router.delete('/:month', async (req, res) => {
    const { id, month: m } = validate(reviewParams, req.params);
    await monthClose.clearReview(principalOf(req), id, m);
    res.status(204).end();
  });
  return router;
}
