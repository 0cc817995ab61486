import { Router } from 'express';
import { z } from 'zod';
import { PORTFOLIO_CONDITIONS, PORTFOLIO_PERIODS, PORTFOLIO_SORTS } from '@shared/portfolio/portfolio-dto';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, pageQuerySchema, validate } from '../../../platform/validation';
import type { PortfolioService } from '../domain/portfolio-service';
import type { SiteDashboardService } from '../domain/site-dashboard-service';

const date = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, 'must be a date YYYY-MM-DD');
const month = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'must be a month YYYY-MM');
const portfolioQuery = pageQuerySchema(PORTFOLIO_SORTS, 'percentOfBudget').extend({
  period: z.enum(PORTFOLIO_PERIODS).default('month'),
  from: date.optional(),
  to: date.optional(),
  tag: z.string().max(40).optional(),
  condition: z.enum(PORTFOLIO_CONDITIONS).optional(),
  organisationId: z.coerce.number().int().positive().optional(),
});
const overviewQuery = z.object({ from: date, to: date });
const gridQuery = z.object({ month });
const monthlyQuery = z.object({ from: month, to: month, format: z.enum(['json', 'csv']).default('json') });

/** /api/portfolio */
export function portfolioRouter(portfolio: PortfolioService): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json(await portfolio.portfolio(principalOf(req), validate(portfolioQuery, req.query, 'Query')));
  });
  return router;
}

/** /api/sites/:id/overview, /hourly-grid and /monthly */
export function siteDashboardRouter(dashboard: SiteDashboardService): Router {
  const router = Router({ mergeParams: true });

  router.get('/overview', async (req, res) => {
    const { from, to } = validate(overviewQuery, req.query, 'Query');
    res.json(await dashboard.overview(principalOf(req), validate(idParam, req.params).id, from, to));
  });

  router.get('/hourly-grid', async (req, res) => {
    res.json(
      await dashboard.hourlyGrid(
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
      const { fileName, csv } = await dashboard.monthlyCsv(principalOf(req), id, q.from, q.to);
      res.setHeader('Content-Type', 'text/csv; charset=utf-8');
      res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
      res.send(csv);
      return;
    }
    res.json(await dashboard.monthly(principalOf(req), id, q.from, q.to));
  });

  return router;
}
