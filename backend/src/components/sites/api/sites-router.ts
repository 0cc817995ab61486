import { Router } from 'express';
import { z } from 'zod';
import { SHARE_ACCESS } from '@shared/auth/roles';
import { isTimeZone, SITE_KINDS, SITE_LIMITS, SITE_SORTS, TAG_PATTERN } from '@shared/sites/site';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, pageQuerySchema, validate } from '../../../platform/validation';
import type { SitesService } from '../domain/sites-service';

const text = (max: number) => z.string().trim().max(max, `must be at most ${max} characters`);
const siteFields = {
  name: text(SITE_LIMITS.nameMax).min(1, 'is required'),
  kind: z.enum(SITE_KINDS, { message: `must be one of ${SITE_KINDS.join(', ')}` }),
  address: text(SITE_LIMITS.addressMax).min(1, 'is required'),
  timeZone: z.string().refine(isTimeZone, 'must be an IANA time zone such as America/Los_Angeles'),
  notes: text(SITE_LIMITS.notesMax),
  tags: z
    .array(
      z
        .string()
        .trim()
        .toLowerCase()
        .max(SITE_LIMITS.tagMax, `must be at most ${SITE_LIMITS.tagMax} characters`)
        .regex(TAG_PATTERN, 'may hold lower-case letters, digits and dashes'),
    )
    .max(SITE_LIMITS.tagsMax, `at most ${SITE_LIMITS.tagsMax} tags`)
    .transform((tags) => [...new Set(tags)]),
};
const createBody = z.strictObject({
  ...siteFields,
  notes: siteFields.notes.optional(),
  tags: siteFields.tags.optional(),
});
const patchBody = z.strictObject(siteFields).partial();
const listQuery = pageQuerySchema(SITE_SORTS, 'name').extend({
  tag: z.string().max(SITE_LIMITS.tagMax).optional(),
  kind: z.enum(SITE_KINDS).optional(),
});
const shareParams = z.object({
  id: z.coerce.number().int().positive(),
  organisationId: z.coerce.number().int().positive(),
});
const shareBody = z.strictObject({ access: z.enum(SHARE_ACCESS) });

/** /api/sites */
export function sitesRouter(sites: SitesService): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    res.json(await sites.list(principalOf(req), validate(listQuery, req.query, 'Query')));
  });

  router.get('/tags', async (req, res) => {
    res.json(await sites.tags(principalOf(req)));
  });

  router.post('/', async (req, res) => {
    res.status(201).json(await sites.create(principalOf(req), validate(createBody, req.body, 'Site')));
  });

  router.get('/:id', async (req, res) => {
    res.json(await sites.get(principalOf(req), validate(idParam, req.params).id));
  });

  router.patch('/:id', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.json(await sites.update(principalOf(req), id, validate(patchBody, req.body, 'Site')));
  });

  router.delete('/:id', async (req, res) => {
    await sites.remove(principalOf(req), validate(idParam, req.params).id);
    res.status(204).end();
  });

  router.put('/:id/shares/:organisationId', async (req, res) => {
    const { id, organisationId } = validate(shareParams, req.params);
    res.json(await sites.share(principalOf(req), id, organisationId, validate(shareBody, req.body, 'Share').access));
  });

  router.delete('/:id/shares/:organisationId', async (req, res) => {
    const { id, organisationId } = validate(shareParams, req.params);
    await sites.unshare(principalOf(req), id, organisationId);
    res.status(204).end();
  });

  return router;
}
