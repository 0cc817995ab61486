import { Router } from 'express';
import { z } from 'zod';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, validate } from '../../../platform/validation';
import type { ReadingsService } from '../domain/readings-service';

const date = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, 'must be a date YYYY-MM-DD');
const month = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'must be a month YYYY-MM');
const overviewQuery = z.object({ from: date, to: date });
const gridQuery = z.object({ month });
const monthlyQuery = z.object({ from: month, to: month, format: z.enum(['json', 'csv']).default('json') });

/** /api/sites/:id/overview, /hourly-grid and /monthly */
export function readingsRouter(readings: ReadingsService): Router {
  const router = Router({ mergeParams: true });

  router.get('/overview', async (req, res) => {
    const { from, to } = validate(overviewQuery, req.query, 'Query');
    res.json(await readings.overview(principalOf(req), validate(idParam, req.params).id, from, to));
  });

  router.get('/hourly-grid', async (req, res) => {
    res.json(
      await readings.hourlyGrid(
        principalOf(req),
        validate(idParam, req.params).id,
        validate(gridQuery, req.query, 'Query').month,
      ),
    );
  });

  router.get('/monthly', async (req, res) => {
    const { id } = validate(idParam, req.params);
    const q = validate(monthlyQuery, req.query, 'Query');
    if (q.format === 'csv') {
      const { fileName, csv } = await readings.monthlyCsv(principalOf(req), id, q.from, q.to);
      res.setHeader('Content-Type', 'text/csv; charset=utf-8');
      res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
      res.send(csv);
      return;
    }
    res.json(await readings.monthly(principalOf(req), id, q.from, q.to));
  });

  return router;
}
