import { Router, type Request } from 'express';
import { z } from 'zod';
import { UPLOAD_KINDS } from '@shared/ingest/upload-kind';
import { ROW_ERROR_POLICIES, type RejectionDto } from '@shared/uploads/upload';
import { AppError } from '../../../platform/app-error';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, validate } from '../../../platform/validation';
import type { UploadsService } from '../domain/uploads-service';
import { mappingSchema, overridesSchema } from './mapping-schema';
import { receiveUpload } from './multipart-upload';

const json = <S extends z.ZodType>(schema: S) =>
  z
    .string()
    .transform((text, ctx) => {
      try {
        return JSON.parse(text) as unknown;
      } catch {
        ctx.addIssue({ code: 'custom', message: 'is not valid JSON' });
        return z.NEVER;
      }
    })
    .pipe(schema);

const uploadFields = z.strictObject({
  mapping: json(mappingSchema).optional(),
  overrides: json(overridesSchema).optional(),
  profileId: z.coerce.number().int().positive().optional(),
  kind: z.enum(UPLOAD_KINDS).optional(),
  replaceConflicts: z
    .enum(['true', 'false'])
    .default('false')
    .transform((v) => v === 'true'),
  rowErrors: z.enum(ROW_ERROR_POLICIES).default('keep-valid'),
  clientRef: z
    .string()
    .regex(/^[A-Za-z0-9_-]{1,40}$/, 'must be 1–40 letters, digits, - or _')
    .optional(),
});
const listQuery = z.object({
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
  clientRef: z.string().max(40).optional(),
});
const rejectionsQuery = z.object({
  format: z.enum(['json', 'csv']).default('json'),
  offset: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(10_000).default(200),
});

/** An API key reaches only its own sites; anything else looks like it does not exist. */
function assertKeyScope(req: Request, siteId: number): void {
  if (req.apiKey && !req.apiKey.siteIds.includes(siteId)) throw AppError.notFound('Site');
}

/** A CSV cell; text that a spreadsheet would run as a formula (file content echoed in messages) is defused with `'`. */
function csvCell(value: string | number | null): string {
  const raw = value === null ? '' : String(value);
  const text = typeof value === 'string' && /^[=+\-@\t\r]/.test(raw) ? `'${raw}` : raw;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** /api/sites/:id/uploads and /api/uploads/:id… */
export function uploadsRouter(uploads: UploadsService, maxBytes: number): Router {
  const router = Router();

  router.post('/sites/:id/uploads', async (req, res) => {
    const { id } = validate(idParam, req.params);
    const principal = principalOf(req);
    assertKeyScope(req, id);
    const result = await receiveUpload(req, maxBytes, async (fields, file, fileName) => {
      const f = validate(uploadFields, fields, 'Upload');
      const mapping = f.mapping ?? (f.profileId ? await uploads.profileMapping(principal, f.profileId) : undefined);
      return uploads.ingest(principal, id, {
        fileName,
        file,
        mapping,
        overrides: f.overrides,
        kind: f.kind,
        replaceConflicts: f.replaceConflicts,
        rowErrors: f.rowErrors,
        clientRef: f.clientRef,
        apiKeyId: req.apiKey?.id,
      });
    });
    res.status(result.outcome === 'imported' ? 201 : 200).json(result);
  });

  router.get('/sites/:id/uploads', async (req, res) => {
    res.json(
      await uploads.list(principalOf(req), validate(idParam, req.params).id, validate(listQuery, req.query, 'Query')),
    );
  });

  router.get('/uploads/:id', async (req, res) => {
    const upload = await uploads.get(principalOf(req), validate(idParam, req.params).id);
    assertKeyScope(req, upload.siteId);
    res.json(upload);
  });

  router.get('/uploads/:id/rejections', async (req, res) => {
    const { id } = validate(idParam, req.params);
    const q = validate(rejectionsQuery, req.query, 'Query');
    if (q.format === 'json') {
      const { items, total } = await uploads.rejections(principalOf(req), id, { offset: q.offset, limit: q.limit });
      res.json({ items, total });
      return;
    }
    const first = await uploads.rejections(principalOf(req), id, { offset: 0, limit: 10_000 });
    const name = first.upload.fileName.replace(/\.[^.]*$/, '').replace(/[^A-Za-z0-9_-]+/g, '-');
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${name}-rejected-rows.csv"`);
    const line = (r: RejectionDto) =>
      [first.upload.fileName, r.row, r.column, r.kind, r.message].map(csvCell).join(',');
    res.send(['file,row,column,kind,reason', ...first.items.map(line)].join('\r\n') + '\r\n');
  });

  router.post('/uploads/:id/rollback', async (req, res) => {
    res.json(await uploads.rollBack(principalOf(req), validate(idParam, req.params).id));
  });

  return router;
}
