import { Router } from 'express';
import { z } from 'zod';
import { REJECTION_KINDS, type RejectionDto } from '@shared/uploads/upload';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, pageQuerySchema, validate } from '../../../platform/validation';
import type { UploadConflictsService } from '../domain/upload-conflicts-service';
import type { UploadsService } from '../domain/uploads-service';

const rejectionsQuery = pageQuerySchema(['row'], 'row').extend({
  format: z.enum(['json', 'csv']).default('json'),
  kind: z.enum(REJECTION_KINDS).optional(),
});
const replaceBody = z
  .strictObject({
    siteId: z.number().int().positive(),
    date: z.iso.date({ message: 'must be a date (YYYY-MM-DD)' }),
  })
  .partial()
  .refine((b) => (b.siteId === undefined) === (b.date === undefined), 'give both siteId and date, or neither');
const repeatsBody = z.strictObject({ choice: z.enum(['keep-first', 'keep-last', 'sum']) });

/** Downloads rows needing attention at most this many at a time (the upload stores at most 10,000). */
const CSV_ROWS = 10_000;

/** A CSV cell; text that a spreadsheet would run as a formula (file content echoed in messages) is defused with `'`. */
function csvCell(value: string | number | null): string {
  const raw = value === null ? '' : String(value);
  const text = typeof value === 'string' && /^[=+\-@\t\r]/.test(raw) ? `'${raw}` : raw;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** /api/uploads/:id/rejections (paged, or CSV) and /api/uploads/:id/conflicts (summary and after-the-fact actions). */
export function uploadResultsRouter(uploads: UploadsService, conflicts: UploadConflictsService): Router {
  const router = Router();

  router.get('/uploads/:id/rejections', async (req, res) => {
    const { id } = validate(idParam, req.params);
    const q = validate(rejectionsQuery, req.query, 'Query');
    if (q.format === 'json') {
      const page = { offset: q.page * q.pageSize, limit: q.pageSize, kind: q.kind };
      const { items, total } = await uploads.rejections(principalOf(req), id, page);
      res.json({ items, total, page: q.page, pageSize: q.pageSize });
      return;
    }
    const all = await uploads.rejections(principalOf(req), id, { offset: 0, limit: CSV_ROWS, kind: q.kind });
    const name = all.upload.fileName.replace(/\.[^.]*$/, '').replace(/[^A-Za-z0-9_-]+/g, '-');
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${name}-rejected-rows.csv"`);
    const line = (r: RejectionDto) => [all.upload.fileName, r.row, r.column, r.kind, r.message].map(csvCell).join(',');
    res.send(['file,row,column,kind,reason', ...all.items.map(line)].join('\r\n') + '\r\n');
  });

  router.get('/uploads/:id/conflicts', async (req, res) => {
    res.json(await conflicts.summary(principalOf(req), validate(idParam, req.params).id));
  });
  router.post('/uploads/:id/conflicts/replace', async (req, res) => {
    const { id } = validate(idParam, req.params);
    const body = validate(replaceBody, req.body ?? {}, 'Replace');
    const day = body.siteId !== undefined ? { siteId: body.siteId, date: body.date! } : undefined;
    res.json(await conflicts.replace(principalOf(req), id, day));
  });
  router.post('/uploads/:id/conflicts/repeats', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.json(await conflicts.resolveRepeats(principalOf(req), id, validate(repeatsBody, req.body, 'Repeats').choice));
  });

  return router;
}
