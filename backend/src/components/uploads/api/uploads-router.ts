import { Router, type Request, type Response } from 'express';
import { z } from 'zod';
import { DATE_ORDERS } from '@shared/ingest/date-order';
import { UPLOAD_KINDS } from '@shared/ingest/upload-kind';
import { IN_FILE_REPEAT_POLICIES, ROW_ERROR_POLICIES, type UploadDto } from '@shared/uploads/upload';
import { AppError } from '../../../platform/app-error';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, pageQuerySchema, validate } from '../../../platform/validation';
import type { UploadTarget } from '../domain/upload-scope';
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
  repeats: z.enum(IN_FILE_REPEAT_POLICIES).default('not-stored'),
  dateOrder: z.enum(DATE_ORDERS).optional(),
  clientRef: z
    .string()
    .regex(/^[A-Za-z0-9_-]{1,40}$/, 'must be 1–40 letters, digits, - or _')
    .optional(),
});
const listQuery = pageQuerySchema(['created'], 'created').extend({ clientRef: z.string().max(40).optional() });

/** An API key reaches only its own sites; anything else looks like it does not exist. */
export function assertKeyScope(req: Request, siteIds: number[]): void {
  if (req.apiKey && siteIds.some((id) => !req.apiKey!.siteIds.includes(id))) throw AppError.notFound('Upload');
}

const sitesOf = (upload: UploadDto) => (upload.siteId !== null ? [upload.siteId] : upload.sites.map((s) => s.siteId));

/** /api/sites/:id/uploads (one site's files), /api/uploads (an organisation's files), /api/uploads/:id */
export function uploadsRouter(uploads: UploadsService, maxBytes: number): Router {
  const router = Router();

  const send = (target: (req: Request) => UploadTarget) => async (req: Request, res: Response) => {
    const principal = principalOf(req);
    const to = target(req);
    const result = await receiveUpload(req, maxBytes, async (fields, file, fileName) => {
      const f = validate(uploadFields, fields, 'Upload');
      const mapping = f.mapping ?? (f.profileId ? await uploads.profileMapping(principal, f.profileId) : undefined);
      return uploads.ingest(principal, to, {
        fileName,
        file,
        mapping,
        overrides: f.overrides,
        kind: f.kind,
        replaceConflicts: f.replaceConflicts,
        rowErrors: f.rowErrors,
        repeats: f.repeats,
        dateOrder: f.dateOrder,
        clientRef: f.clientRef,
        apiKey: req.apiKey,
      });
    });
    res.status(result.outcome === 'imported' ? 201 : 200).json(result);
  };

  router.post(
    '/sites/:id/uploads',
    send((req) => {
      const { id } = validate(idParam, req.params);
      if (req.apiKey && !req.apiKey.siteIds.includes(id)) throw AppError.notFound('Site');
      return { siteId: id };
    }),
  );
  router.post(
    '/uploads',
    send(() => ({ organisation: true })),
  );

  router.get('/sites/:id/uploads', async (req, res) => {
    const q = validate(listQuery, req.query, 'Query');
    res.json(await uploads.list(principalOf(req), validate(idParam, req.params).id, q));
  });
  router.get('/uploads', async (req, res) => {
    res.json(await uploads.list(principalOf(req), null, validate(listQuery, req.query, 'Query')));
  });

  router.get('/uploads/:id', async (req, res) => {
    const upload = await uploads.get(principalOf(req), validate(idParam, req.params).id);
    assertKeyScope(req, sitesOf(upload));
    res.json(upload);
  });

  router.post('/uploads/:id/rollback', async (req, res) => {
    res.json(await uploads.rollBack(principalOf(req), validate(idParam, req.params).id));
  });

  return router;
}
