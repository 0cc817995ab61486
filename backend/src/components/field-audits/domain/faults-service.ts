import { createHash } from 'node:crypto';
import type { Readable } from 'node:stream';
import type { DataSource } from 'typeorm';
import {
  FIELD_AUDIT_LIMITS,
  type FaultInput,
  type FieldAuditDto,
  type PhotoType,
} from '@shared/field-audits/field-audit-dto';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { FileStore } from '../../../platform/storage/file-store';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { FaultsRepository } from '../data/faults-repository';
import type { FieldAuditsRepository } from '../data/field-audits-repository';
import type { ZoneTestsRepository } from '../data/zone-tests-repository';
import type { FieldAuditAccess } from './field-audit-access';
import type { FieldAuditsService } from './field-audits-service';
import { sniffImageType } from './photo-check';

/** Faults found on an audit and their photos (kept through platform/storage, served to site readers only). */
export class FaultsService {
  constructor(
    private readonly db: DataSource,
    private readonly faults: FaultsRepository,
    private readonly tests: ZoneTestsRepository,
    private readonly audits: FieldAuditsRepository,
    private readonly access: FieldAuditAccess,
    private readonly sites: SitesService,
    private readonly store: FileStore,
    private readonly auditsService: FieldAuditsService,
    private readonly log: AuditRepository,
  ) {}

  async add(principal: Principal, auditId: number, input: FaultInput): Promise<FieldAuditDto> {
    const { site } = await this.access.load(principal, auditId, 'write');
    await this.checkZoneTest(auditId, input);
    await this.db.transaction(async (em) => {
      const id = await this.faults.insert(em, auditId, input);
      await this.audits.touch(em, auditId);
      await this.record(em, principal, site.organisationId, id, 'create', { auditId, ...input });
    });
    return this.auditsService.get(principal, auditId);
  }

  async update(principal: Principal, auditId: number, faultId: number, input: FaultInput): Promise<FieldAuditDto> {
    const { site } = await this.access.load(principal, auditId, 'write');
    if (!(await this.faults.find(auditId, faultId))) throw AppError.notFound('Fault');
    await this.checkZoneTest(auditId, input);
    await this.db.transaction(async (em) => {
      await this.faults.update(em, faultId, input);
      await this.audits.touch(em, auditId);
      await this.record(em, principal, site.organisationId, faultId, 'update', { auditId, ...input });
    });
    return this.auditsService.get(principal, auditId);
  }

  async remove(principal: Principal, auditId: number, faultId: number): Promise<void> {
    const { site } = await this.access.load(principal, auditId, 'write');
    const fault = await this.faults.find(auditId, faultId);
    if (!fault) throw AppError.notFound('Fault');
    await this.db.transaction(async (em) => {
      await this.faults.delete(em, faultId);
      await this.audits.touch(em, auditId);
      await this.record(em, principal, site.organisationId, faultId, 'delete', { auditId, kind: fault.kind });
    });
  }

  /** Stores a photo of a fault: image bytes only (JPEG, PNG, WebP by signature), at most the size limit. */
  async addPhoto(
    principal: Principal,
    ids: { auditId: number; faultId: number },
    photo: { bytes: Buffer; declaredType: string | undefined },
  ): Promise<FieldAuditDto> {
    const { site } = await this.access.load(principal, ids.auditId, 'write');
    if (!(await this.faults.find(ids.auditId, ids.faultId))) throw AppError.notFound('Fault');
    const type = checkPhoto(photo.bytes, photo.declaredType);
    if ((await this.faults.photoCount(ids.faultId)) >= FIELD_AUDIT_LIMITS.photosPerFault)
      throw AppError.invalid('file', `a fault has at most ${FIELD_AUDIT_LIMITS.photosPerFault} photos`);
    const storageKey = await this.keep(photo.bytes);
    await this.db.transaction(async (em) => {
      const id = await this.faults.insertPhoto(em, {
        faultId: ids.faultId,
        storageKey,
        contentType: type,
        sizeBytes: photo.bytes.length,
        createdBy: principal.userId,
      });
      await this.audits.touch(em, ids.auditId);
      await this.record(em, principal, site.organisationId, ids.faultId, 'photo', {
        photoId: id,
        bytes: photo.bytes.length,
      });
    });
    return this.auditsService.get(principal, ids.auditId);
  }

  /** The photo's bytes, for anyone who may read the site; 404 as for the site otherwise. */
  async photo(principal: Principal, photoId: number): Promise<{ type: PhotoType; size: number; stream: Readable }> {
    const photo = await this.faults.photoOwner(photoId);
    if (!photo) throw AppError.notFound('Photo');
    await this.sites.requireLevel(principal, photo.siteId, 'read').catch((error: unknown) => {
      if (error instanceof AppError && error.code === 'not_found') throw AppError.notFound('Photo');
      throw error;
    });
    return { type: photo.contentType, size: photo.sizeBytes, stream: this.store.open(photo.storageKey) };
  }

  async removePhoto(principal: Principal, photoId: number): Promise<void> {
    const photo = await this.faults.photoOwner(photoId);
    if (!photo) throw AppError.notFound('Photo');
    const { site } = await this.access.load(principal, photo.auditId, 'write');
    // The bytes stay in the content-addressed store (another record may share them), as uploads do.
    await this.db.transaction(async (em) => {
      await this.faults.deletePhoto(em, photoId);
      await this.audits.touch(em, photo.auditId);
      await this.record(em, principal, site.organisationId, photo.faultId, 'photo-delete', { photoId });
    });
  }

  private async keep(bytes: Buffer): Promise<string> {
    const pending = this.store.begin();
    try {
      await pending.write(bytes);
      return await pending.keep(createHash('sha256').update(bytes).digest('hex'));
    } catch (error) {
      await pending.discard();
      throw error;
    }
  }

  private async checkZoneTest(auditId: number, input: FaultInput): Promise<void> {
    if (input.zoneTestId != null && !(await this.tests.find(auditId, input.zoneTestId)))
      throw AppError.invalid('zoneTestId', 'is not a zone test of this audit');
  }

  private record(
    em: Parameters<AuditRepository['record']>[0],
    principal: Principal,
    organisationId: number,
    id: number,
    action: string,
    changes: unknown,
  ): Promise<void> {
    return this.log.record(em, {
      userId: principal.userId,
      organisationId,
      entity: 'field_audit_fault',
      entityId: id,
      action,
      changes,
    });
  }
}

function checkPhoto(bytes: Buffer, declaredType: string | undefined): PhotoType {
  if (bytes.length === 0) throw AppError.invalid('file', 'send the photo as the request body');
  if (bytes.length > FIELD_AUDIT_LIMITS.photoMaxBytes)
    throw new AppError(
      'payload_too_large',
      `Photos are at most ${FIELD_AUDIT_LIMITS.photoMaxBytes / 1024 / 1024} MB.`,
      [{ field: 'file', message: 'is over the size limit' }],
    );
  const type = sniffImageType(bytes);
  if (!type) throw AppError.invalid('file', 'is not a JPEG, PNG or WebP image');
  if (declaredType && declaredType.split(';')[0]!.trim().toLowerCase() !== type)
    throw AppError.invalid('file', `is a ${type} image but was sent as ${declaredType}`);
  return type;
}
