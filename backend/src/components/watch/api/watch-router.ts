import { Router } from 'express';
import { z } from 'zod';
import { DEFAULT_THRESHOLDS, type ThresholdName } from '@shared/watch/alert-thresholds';
import { principalOf } from '../../../platform/auth/guards';
import { AppError } from '../../../platform/app-error';
import { idParam, validate } from '../../../platform/validation';
import type { WatchRunsRepository } from '../data/watch-runs-repository';
import type { WatchService } from '../domain/watch-service';
import type { WatchSettingsService } from '../domain/watch-settings-service';

const MAX_RECHECK_DAYS = 400;
const MAX_SITES = 5000;
const siteId = z.number().int().positive();
const runBody = z
  .strictObject({
    from: z.iso.datetime({ offset: true }).optional(),
    to: z.iso.datetime({ offset: true }).optional(),
    siteId: siteId.optional(),
    siteIds: z.array(siteId).min(1).max(MAX_SITES).optional(),
  })
  .refine((b) => !b.to || b.from, { message: 'a re-check needs "from" as well as "to"', path: ['from'] })
  .refine((b) => !(b.siteId && b.siteIds), { message: 'give "siteId" or "siteIds", not both', path: ['siteIds'] });
const listQuery = z.object({
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
});
const hour = z.number().int().min(0).max(23);
const thresholdNames = Object.keys(DEFAULT_THRESHOLDS) as [ThresholdName, ...ThresholdName[]];
const settingsBody = z.strictObject({
  irrigationWindow: z.strictObject({ startHour: hour, endHour: hour }).optional(),
  thresholds: z.partialRecord(z.enum(thresholdNames), z.number().min(0)),
});

/** /api/watch: run history and "run now" / "re-check a range" for administrators. */
export function watchRouter(watch: WatchService, runs: WatchRunsRepository): Router {
  const router = Router();
  const requireAdmin = (role: string) => {
    if (role !== 'admin') throw AppError.forbidden('Only administrators can run the watch or see its runs.');
  };

  router.get('/runs', async (req, res) => {
    const principal = principalOf(req);
    requireAdmin(principal.role);
    const q = validate(listQuery, req.query, 'Query');
    const { items, total } = await runs.list(principal.organisationId, q.page, q.pageSize);
    // A run over every site may name other organisations' sites in its errors: those stay hidden.
    const own = new Set(await runs.ownSiteIds(principal.organisationId));
    res.json({
      items: items.map(({ organisationId: _o, ...r }) => ({ ...r, errors: r.errors.filter((e) => own.has(e.siteId)) })),
      total,
      page: q.page,
      pageSize: q.pageSize,
    });
  });

  router.get('/runs/:id', async (req, res) => {
    const principal = principalOf(req);
    requireAdmin(principal.role);
    const run = await runs.getWithOwner(validate(idParam, req.params).id);
    if (!run || (run.organisationId !== null && run.organisationId !== principal.organisationId))
      throw AppError.notFound('Watch run');
    const own = new Set(await runs.ownSiteIds(principal.organisationId));
    const { organisationId: _o, ...dto } = run;
    res.json({
      ...dto,
      errors: dto.errors.filter((e) => own.has(e.siteId)),
      warnings: dto.warnings.filter((w) => own.has(w.siteId)),
    });
  });

  // Starts a run (all the organisation's sites, a list, or one) in the background: 202 with the run to follow.
  router.post('/runs', async (req, res) => {
    const principal = principalOf(req);
    requireAdmin(principal.role);
    const body = validate(runBody, req.body ?? {}, 'Run');
    const from = body.from ? new Date(body.from) : undefined;
    const to = body.to ? new Date(body.to) : body.from ? new Date() : undefined;
    if (from && to) {
      if (to <= from) throw AppError.invalid('to', 'must be after "from"');
      if (to.getTime() - from.getTime() > MAX_RECHECK_DAYS * 86_400_000)
        throw AppError.invalid('from', `a re-check covers at most ${MAX_RECHECK_DAYS} days`);
    }
    const siteIds = body.siteIds ?? (body.siteId ? [body.siteId] : undefined);
    if (siteIds) {
      const own = new Set(await runs.ownSiteIds(principal.organisationId));
      const foreign = siteIds.find((id) => !own.has(id));
      if (foreign !== undefined) throw AppError.notFound(`Site ${foreign}`);
    }
    const started = await watch.start({
      trigger: from ? 'recheck' : 'manual',
      organisationId: principal.organisationId,
      requestedBy: principal.userId,
      ...(siteIds ? { siteIds: [...new Set(siteIds)] } : {}),
      fromUtc: from,
      toUtc: to,
    });
    if (!started) throw new AppError('conflict', 'The watch is running already; try again when it has finished.');
    res
      .status(202)
      .location(`/api/watch/runs/${started.runId}`)
      .json(await runs.get(started.runId));
  });

  return router;
}

/** /api/sites/:id/watch-settings */
export function watchSettingsRouter(settings: WatchSettingsService): Router {
  const router = Router({ mergeParams: true });
  router.get('/', async (req, res) => {
    res.json(await settings.get(principalOf(req), validate(idParam, req.params).id));
  });
  router.put('/', async (req, res) => {
    res.json(
      await settings.update(
        principalOf(req),
        validate(idParam, req.params).id,
        validate(settingsBody, req.body, 'Watch settings'),
      ),
    );
  });
  return router;
}
