import { Router } from 'express';
import { z } from 'zod';
import { PORTFOLIO_CONDITIONS, PORTFOLIO_PERIODS, PORTFOLIO_SORTS } from '@shared/portfolio/portfolio-dto';
import { principalOf } from '../../../platform/auth/guards';
import { pageQuerySchema, validate } from '../../../platform/validation';
import type { PortfolioService } from '../domain/portfolio-service';

const date = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, 'must be a date YYYY-MM-DD');
const portfolioQuery = pageQuerySchema(PORTFOLIO_SORTS, 'percentOfBudget').extend({
  period: z.enum(PORTFOLIO_PERIODS).default('month'),
  from: date.optional(),
  to: date.optional(),
  tag: z.string().max(40).optional(),
  condition: z.enum(PORTFOLIO_CONDITIONS).optional(),
  organisationId: z.coerce.number().int().positive().optional(),
});

/** /api/portfolio */
export function portfolioRouter(portfolio: PortfolioService): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json(await portfolio.portfolio(principalOf(req), validate(portfolioQuery, req.query, 'Query')));
  });
  return router;
}
