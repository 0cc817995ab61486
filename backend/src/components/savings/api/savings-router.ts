import { Router } from 'express';
import { z } from 'zod';
import { BASELINE_MODEL_FORMS } from '@shared/savings/baseline-model';
import { SAVINGS_CHANGE_KINDS } from '@shared/savings/savings-project-dto';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, validate } from '../../../platform/validation';
import type { SavingsProjectsService } from '../domain/savings-projects-service';
import type { SavingsReportService } from '../domain/savings-report-service';
import { savingsCsv, savingsPdf } from '../domain/savings-exports';
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
const createBody = z.strictObject(fields);
const patchBody = z.strictObject(fields).partial();
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

/** /api/savings-projects/:id, its report (JSON or CSV) and report.pdf */
export function savingsProjectsRouter(projects: SavingsProjectsService, reports: SavingsReportService): Router {
  const router = Router();
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
