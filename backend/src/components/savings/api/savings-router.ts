import { Router } from 'express';
import { z } from 'zod';
import { BASELINE_MODEL_FORMS } from '@shared/savings/baseline-model';
import {
  SAVINGS_BOOK_SORTS,
  SAVINGS_CHANGE_KINDS,
  SAVINGS_LIMITS,
  SAVINGS_PROJECT_STATUSES,
} from '@shared/savings/savings-project-dto';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, pageQuerySchema, validate } from '../../../platform/validation';
import type { SavingsBookService } from '../domain/savings-book-service';
import type { SavingsProjectsService } from '../domain/savings-projects-service';
import type { SavingsReportService } from '../domain/savings-report-service';
import { savingsCsv, savingsPdf } from '../domain/savings-exports';
import type { SavingsHandoutService } from '../domain/savings-handout-service';
import { sendFile } from '../../../platform/send-file';

const month = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'must be a month YYYY-MM');
const fields = {
  title: z.string().trim().min(1, 'is required').max(160, 'must be at most 160 characters'),
  changeKind: z.enum(SAVINGS_CHANGE_KINDS, { message: `must be one of ${SAVINGS_CHANGE_KINDS.join(', ')}` }),
  changeDescription: z.string().max(2000, 'must be at most 2,000 characters').optional(),
  installedOn: z.iso.date('must be a date YYYY-MM-DD'),
  baselineFrom: month,
  baselineTo: month,
  reportingFrom: month,
  reportingTo: month,
  modelForm: z.enum(BASELINE_MODEL_FORMS, { message: `must be one of ${BASELINE_MODEL_FORMS.join(', ')}` }),
};
const optionalFields = {
  changeDescription: fields.changeDescription,
  retrofits: z
    .array(z.string().trim().min(1, 'is empty').max(SAVINGS_LIMITS.retrofitMax, 'is too long'))
    .max(SAVINGS_LIMITS.retrofitsMax, `at most ${SAVINGS_LIMITS.retrofitsMax} lines`)
    .optional(),
  installedCost: z.number().min(0, 'must be zero or more').max(SAVINGS_LIMITS.costMax).nullable().optional(),
  costCurrency: z
    .string()
    .regex(/^[A-Z]{3}$/, 'must be a three-letter currency code')
    .nullable()
    .optional(),
};
const createBody = z.strictObject({ ...fields, ...optionalFields });
const patchBody = z
  .strictObject({ ...fields, ...optionalFields, reason: z.string().trim().max(500).optional() })
  .partial();
const bookQuery = pageQuerySchema(SAVINGS_BOOK_SORTS, 'installedOn').extend({
  scope: z.enum(['mine', 'all']).optional(),
  status: z.enum(SAVINGS_PROJECT_STATUSES).optional(),
});
const historyQuery = pageQuerySchema(['at'], 'at');
const reportQuery = z.object({ format: z.enum(['json', 'csv']).default('json') });

/** /api/sites/:id/savings-projects */
export function siteSavingsProjectsRouter(projects: SavingsProjectsService): Router {
  const router = Router({ mergeParams: true });
  router.get('/', async (req, res) => {
    res.json(await projects.list(principalOf(req), validate(idParam, req.params).id));
  });
  router.post('/', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res
      .status(201)
      .json(await projects.create(principalOf(req), id, validate(createBody, req.body, 'Savings project')));
  });
  return router;
}

/**
 * /api/savings-projects (the savings book), /:id with its lifecycle (installed, archive, restore) and history, its
 * report (JSON or CSV), report.pdf and the client handout.pdf
 */
export function savingsProjectsRouter(services: {
  projects: SavingsProjectsService;
  reports: SavingsReportService;
  book: SavingsBookService;
  handouts: SavingsHandoutService;
}): Router {
  const { projects, reports, book, handouts } = services;
  const router = Router();
  router.get('/', async (req, res) => {
    res.json(await book.book(principalOf(req), validate(bookQuery, req.query, 'Query')));
  });
  router.get('/:id', async (req, res) => {
    res.json(await projects.get(principalOf(req), validate(idParam, req.params).id));
  });
  router.patch('/:id', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.json(await projects.update(principalOf(req), id, validate(patchBody, req.body, 'Savings project')));
  });
  router.delete('/:id', async (req, res) => {
    await projects.remove(principalOf(req), validate(idParam, req.params).id);
    res.status(204).end();
  });
  router.post('/:id/installed', async (req, res) => {
    res.json(await projects.markInstalled(principalOf(req), validate(idParam, req.params).id));
  });
  router.post('/:id/archive', async (req, res) => {
    res.json(await projects.setArchived(principalOf(req), validate(idParam, req.params).id, true));
  });
  router.post('/:id/restore', async (req, res) => {
    res.json(await projects.setArchived(principalOf(req), validate(idParam, req.params).id, false));
  });
  router.get('/:id/history', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.json(await projects.history(principalOf(req), id, validate(historyQuery, req.query, 'Query')));
  });
  router.get('/:id/handout.pdf', async (req, res) => {
    const { id } = validate(idParam, req.params);
    const { pdf, fileName } = await handouts.handout(principalOf(req), id);
    sendFile(res, pdf, 'application/pdf', fileName);
  });
  router.get('/:id/report', async (req, res) => {
    const { id } = validate(idParam, req.params);
    const { format } = validate(reportQuery, req.query, 'Query');
    const report = await reports.report(principalOf(req), id);
    if (format === 'csv') return sendFile(res, savingsCsv(report), 'text/csv; charset=utf-8', `savings-${id}.csv`);
    res.json(report);
  });
  router.get('/:id/report.pdf', async (req, res) => {
    const { id } = validate(idParam, req.params);
    sendFile(res, await savingsPdf(await reports.report(principalOf(req), id)), 'application/pdf', `savings-${id}.pdf`);
  });
  return router;
}
