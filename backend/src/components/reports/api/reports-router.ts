import { Router } from 'express';
import { z } from 'zod';
import { COMPLIANCE_SORTS } from '@shared/reports/compliance-report-dto';
import { SITE_KINDS } from '@shared/sites/site';
import { principalOf } from '../../../platform/auth/guards';
import { pageQuerySchema, validate } from '../../../platform/validation';
import { sendFile } from '../../../platform/send-file';
import type { ComplianceService } from '../domain/compliance-service';
import type { ComplianceNoticeService } from '../domain/compliance-notice-service';
import { complianceCsv, compliancePdf } from '../domain/compliance-exports';

const month = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'must be a month YYYY-MM');
const complianceQuery = z.object({
  year: z.coerce.number().int().min(2000, 'must be 2000 or later').max(2100, 'must be 2100 or earlier'),
  month: month.optional(),
  kind: z.enum(SITE_KINDS, { message: `must be one of ${SITE_KINDS.join(', ')}` }).optional(),
  tag: z.string().trim().min(1).max(40).optional(),
  owner: z.coerce.number().int().positive().optional(),
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
  sort: z.enum(COMPLIANCE_SORTS).default('rank'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  format: z.enum(['json', 'csv']).default('json'),
});
const historyQuery = pageQuerySchema(['sentAt'], 'sentAt');
const noticeParams = z.object({ siteId: z.coerce.number().int().positive() });
const noticeBody = z.strictObject({
  month: month.optional(),
  message: z.string().max(2000, 'must be at most 2,000 characters').optional(),
});

/** /api/reports/compliance (JSON, CSV, PDF) and its notices. */
export function reportsRouter(compliance: ComplianceService, notices: ComplianceNoticeService): Router {
  const router = Router();
  router.get('/compliance', async (req, res) => {
    const { format, ...q } = validate(complianceQuery, req.query, 'Query');
    if (format === 'csv') {
      // An export holds every row of the filtered ranking, not just the page on screen.
      const all = await compliance.ranking(principalOf(req), { ...q, page: 0, pageSize: 100_000 });
      return sendFile(res, complianceCsv(all), 'text/csv; charset=utf-8', `compliance-${q.month ?? q.year}.csv`);
    }
    res.json(await compliance.ranking(principalOf(req), q));
  });
  router.get('/compliance.pdf', async (req, res) => {
    const { format: _format, ...q } = validate(complianceQuery, req.query, 'Query');
    const all = await compliance.ranking(principalOf(req), { ...q, page: 0, pageSize: 100_000 });
    sendFile(res, await compliancePdf(all), 'application/pdf', `compliance-${q.month ?? q.year}.pdf`);
  });
  router.get('/compliance/:siteId/notices', async (req, res) => {
    const { siteId } = validate(noticeParams, req.params);
    res.json(await compliance.noticeHistory(principalOf(req), siteId, validate(historyQuery, req.query, 'Query')));
  });
  router.post('/compliance/:siteId/notice', async (req, res) => {
    const { siteId } = validate(noticeParams, req.params);
    res.status(201).json(await notices.send(principalOf(req), siteId, validate(noticeBody, req.body ?? {}, 'Notice')));
  });
  return router;
}
