import express, { Router } from 'express';
import { z } from 'zod';
import { CATCH_UNITS, THROAT_UNITS } from '@shared/field-audits/catch-can';
import {
  AUDIT_STATUSES,
  AUDITED_HEAD_TYPES,
  FAULT_KINDS,
  FAULT_STATUSES,
  FIELD_AUDIT_LIMITS as L,
  FIELD_AUDIT_SORTS,
} from '@shared/field-audits/field-audit-dto';
import { AppError } from '../../../platform/app-error';
import { principalOf } from '../../../platform/auth/guards';
import { idParam, pageQuerySchema, validate } from '../../../platform/validation';
import { sendFile } from '../../../platform/send-file';
import type { FaultsService } from '../domain/faults-service';
import type { FieldAuditReport } from '../domain/field-audit-report';
import type { FieldAuditsService } from '../domain/field-audits-service';
import type { ZoneTestsService } from '../domain/zone-tests-service';
import { photoExtension } from '../domain/photo-check';

const month = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'must be a month YYYY-MM');
const notes = z.string().max(L.notesMax, `must be at most ${L.notesMax} characters`);
const auditFields = {
  title: z.string().trim().min(1, 'is required').max(L.titleMax, `must be at most ${L.titleMax} characters`),
  auditedOn: z.iso.date('must be a date YYYY-MM-DD'),
  scheduleMonth: month,
  daysPerWeek: z.number().int('must be a whole number').min(1, 'must be 1–7').max(7, 'must be 1–7'),
  staticPressurePsi: z
    .number()
    .min(0, 'must be zero or more')
    .max(300, 'must be at most 300 psi')
    .nullable()
    .optional(),
  notes: notes.optional(),
  status: z.enum(AUDIT_STATUSES).optional(),
};
const zoneTestBody = z.strictObject({
  hydrozoneId: z.number().int().positive(),
  headType: z.enum(AUDITED_HEAD_TYPES, { message: `must be one of ${AUDITED_HEAD_TYPES.join(', ')}` }),
  runMinutes: z.number().gt(0, 'must be above 0').max(240, 'must be at most 240 minutes'),
  catchUnit: z.enum(CATCH_UNITS, { message: `must be one of ${CATCH_UNITS.join(', ')}` }),
  throatDiameter: z.number().gt(0, 'must be above 0').max(500).nullable().optional(),
  throatUnit: z.enum(THROAT_UNITS).nullable().optional(),
  catches: z
    .array(z.number().min(0, 'a catch must be zero or more').max(10_000))
    .min(4, 'at least 4 cans')
    .max(L.catchesMax, `at most ${L.catchesMax} cans`),
  pressures: z
    .array(z.strictObject({ location: z.string().trim().min(1).max(L.locationMax), psi: z.number().min(0).max(300) }))
    .max(L.pressuresMax)
    .optional(),
  soilIntakeInPerHour: z.number().gt(0, 'must be above 0').max(10).nullable().optional(),
  slopePercent: z.number().min(0, 'must be zero or more').max(100).nullable().optional(),
  notes: notes.optional(),
});
const faultBody = z.strictObject({
  zoneTestId: z.number().int().positive().nullable().optional(),
  kind: z.enum(FAULT_KINDS, { message: `must be one of ${FAULT_KINDS.join(', ')}` }),
  location: z.string().trim().min(1, 'is required').max(L.locationMax),
  description: notes.optional(),
  status: z.enum(FAULT_STATUSES).optional(),
});
const applyBody = z.strictObject({ efficiency: z.boolean(), flow: z.boolean(), soilIntake: z.boolean() });
const listQuery = pageQuerySchema(FIELD_AUDIT_SORTS, 'auditedOn');
const testParams = z.object({ id: z.coerce.number().int().positive(), testId: z.coerce.number().int().positive() });
const faultParams = z.object({ id: z.coerce.number().int().positive(), faultId: z.coerce.number().int().positive() });

/** Photo bodies are raw image bytes; a declared length over the limit is refused before reading. */
const photoBody = [
  ((req, _res, next) => {
    const length = Number(req.headers['content-length']);
    if (Number.isFinite(length) && length > L.photoMaxBytes)
      throw new AppError('payload_too_large', `Photos are at most ${L.photoMaxBytes / 1024 / 1024} MB.`, [
        { field: 'file', message: 'is over the size limit' },
      ]);
    next();
  }) satisfies express.RequestHandler,
  express.raw({ type: () => true, limit: L.photoMaxBytes }),
];

/** /api/sites/:id/field-audits */
export function siteFieldAuditsRouter(audits: FieldAuditsService): Router {
  const router = Router({ mergeParams: true });
  router.get('/', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.json(await audits.list(principalOf(req), id, validate(listQuery, req.query, 'Query')));
  });
  router.post('/', async (req, res) => {
    const { id } = validate(idParam, req.params);
    const body = validate(z.strictObject(auditFields), req.body, 'Field audit');
    res.status(201).json(await audits.create(principalOf(req), id, body));
  });
  return router;
}

export interface FieldAuditRoutes {
  audits: FieldAuditsService;
  tests: ZoneTestsService;
  faults: FaultsService;
  report: FieldAuditReport;
}

/** /api/field-audits/:id with its zone tests, faults, photos and report.pdf; /api/field-audit-photos/:id */
export function fieldAuditsRouter(s: FieldAuditRoutes): Router {
  const router = Router();
  router.get('/field-audits/:id', async (req, res) => {
    res.json(await s.audits.get(principalOf(req), validate(idParam, req.params).id));
  });
  router.patch('/field-audits/:id', async (req, res) => {
    const { id } = validate(idParam, req.params);
    const body = validate(z.strictObject(auditFields).partial(), req.body, 'Field audit');
    res.json(await s.audits.update(principalOf(req), id, body));
  });
  router.delete('/field-audits/:id', async (req, res) => {
    await s.audits.remove(principalOf(req), validate(idParam, req.params).id);
    res.status(204).end();
  });
  router.get('/field-audits/:id/report.pdf', async (req, res) => {
    const { id } = validate(idParam, req.params);
    sendFile(res, await s.report.pdf(principalOf(req), id), 'application/pdf', `field-audit-${id}.pdf`);
  });
  router.post('/field-audits/:id/zone-tests', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.status(201).json(await s.tests.add(principalOf(req), id, validate(zoneTestBody, req.body, 'Zone test')));
  });
  router.put('/field-audits/:id/zone-tests/:testId', async (req, res) => {
    const { id, testId } = validate(testParams, req.params);
    res.json(await s.tests.update(principalOf(req), id, testId, validate(zoneTestBody, req.body, 'Zone test')));
  });
  router.delete('/field-audits/:id/zone-tests/:testId', async (req, res) => {
    const { id, testId } = validate(testParams, req.params);
    await s.tests.remove(principalOf(req), id, testId);
    res.status(204).end();
  });
  router.post('/field-audits/:id/zone-tests/:testId/apply', async (req, res) => {
    const { id, testId } = validate(testParams, req.params);
    res.json(await s.tests.apply(principalOf(req), id, testId, validate(applyBody, req.body, 'Apply')));
  });
  router.post('/field-audits/:id/faults', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.status(201).json(await s.faults.add(principalOf(req), id, validate(faultBody, req.body, 'Fault')));
  });
  router.put('/field-audits/:id/faults/:faultId', async (req, res) => {
    const { id, faultId } = validate(faultParams, req.params);
    res.json(await s.faults.update(principalOf(req), id, faultId, validate(faultBody, req.body, 'Fault')));
  });
  router.delete('/field-audits/:id/faults/:faultId', async (req, res) => {
    const { id, faultId } = validate(faultParams, req.params);
    await s.faults.remove(principalOf(req), id, faultId);
    res.status(204).end();
  });
  router.post('/field-audits/:id/faults/:faultId/photos', ...photoBody, async (req, res) => {
    const { id, faultId } = validate(faultParams, req.params);
    const bytes = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    const photo = { bytes, declaredType: req.headers['content-type'] };
    res.status(201).json(await s.faults.addPhoto(principalOf(req), { auditId: id, faultId }, photo));
  });
  router.get('/field-audit-photos/:id', async (req, res) => {
    const { id } = validate(idParam, req.params);
    const photo = await s.faults.photo(principalOf(req), id);
    res.setHeader('Content-Type', photo.type);
    res.setHeader('Content-Length', String(photo.size));
    res.setHeader('Content-Disposition', `inline; filename="fault-photo-${id}.${photoExtension(photo.type)}"`);
    // Private: only readers of the site may see it, so no shared cache may keep it.
    res.setHeader('Cache-Control', 'private, max-age=300');
    photo.stream.on('error', () => res.destroy());
    photo.stream.pipe(res);
  });
  router.delete('/field-audit-photos/:id', async (req, res) => {
    await s.faults.removePhoto(principalOf(req), validate(idParam, req.params).id);
    res.status(204).end();
  });
  return router;
}
