import { In, type DataSource, type EntityManager } from 'typeorm';
import type { FaultInput, FaultKind, FaultStatus, PhotoType } from '@shared/field-audits/field-audit-dto';
import { FieldAuditFaultEntity } from './field-audit-fault.entity';
import { FieldAuditPhotoEntity } from './field-audit-photo.entity';

export interface FaultRecord {
  id: number;
  auditId: number;
  zoneTestId: number | null;
  kind: FaultKind;
  location: string;
  description: string;
  status: FaultStatus;
}

export interface PhotoRecord {
  id: number;
  faultId: number;
  storageKey: string;
  contentType: PhotoType;
  sizeBytes: number;
  createdAt: Date;
}

/** A photo with the audit and site it belongs to, for the access check before serving it. */
export interface PhotoOwner extends PhotoRecord {
  auditId: number;
  siteId: number;
}

/** Faults found in audits and their photos; callers check access to the audit first. */
export class FaultsRepository {
  constructor(private readonly db: DataSource) {}

  async ofAudits(auditIds: number[]): Promise<FaultRecord[]> {
    if (!auditIds.length) return [];
    const rows = await this.db
      .getRepository(FieldAuditFaultEntity)
      .find({ where: { auditId: In(auditIds) }, order: { id: 'ASC' } });
    return rows.map(toFault);
  }

  async find(auditId: number, id: number): Promise<FaultRecord | null> {
    const row = await this.db.getRepository(FieldAuditFaultEntity).findOneBy({ auditId, id });
    return row ? toFault(row) : null;
  }

  async insert(em: EntityManager, auditId: number, input: FaultInput): Promise<number> {
    const result = await em.getRepository(FieldAuditFaultEntity).insert({ auditId, ...columns(input) });
    return Number(result.identifiers[0]!['id']);
  }

  async update(em: EntityManager, id: number, input: FaultInput): Promise<void> {
    await em.getRepository(FieldAuditFaultEntity).update({ id }, columns(input));
  }

  async delete(em: EntityManager, id: number): Promise<void> {
    await em.getRepository(FieldAuditFaultEntity).delete({ id });
  }

  async photosOf(faultIds: number[]): Promise<PhotoRecord[]> {
    if (!faultIds.length) return [];
    const rows = await this.db
      .getRepository(FieldAuditPhotoEntity)
      .find({ where: { faultId: In(faultIds) }, order: { id: 'ASC' } });
    return rows.map(toPhoto);
  }

  async photoCount(faultId: number): Promise<number> {
    return this.db.getRepository(FieldAuditPhotoEntity).countBy({ faultId });
  }

  async insertPhoto(
    em: EntityManager,
    photo: { faultId: number; storageKey: string; contentType: PhotoType; sizeBytes: number; createdBy: number },
  ): Promise<number> {
    const result = await em.getRepository(FieldAuditPhotoEntity).insert(photo);
    return Number(result.identifiers[0]!['id']);
  }

  async photoOwner(id: number): Promise<PhotoOwner | null> {
    const rows: Record<string, unknown>[] = await this.db.query(
      `SELECT p.id, p.fault_id AS faultId, p.storage_key AS storageKey, p.content_type AS contentType,
              p.size_bytes AS sizeBytes, p.created_at AS createdAt, f.audit_id AS auditId, a.site_id AS siteId
       FROM field_audit_photo p JOIN field_audit_fault f ON f.id = p.fault_id JOIN field_audit a ON a.id = f.audit_id
       WHERE p.id = ?`,
      [id],
    );
    const r = rows[0];
    if (!r) return null;
    return {
      id: Number(r['id']),
      faultId: Number(r['faultId']),
      storageKey: String(r['storageKey']),
      contentType: r['contentType'] as PhotoType,
      sizeBytes: Number(r['sizeBytes']),
      createdAt: new Date(r['createdAt'] as string),
      auditId: Number(r['auditId']),
      siteId: Number(r['siteId']),
    };
  }

  async deletePhoto(em: EntityManager, id: number): Promise<void> {
    await em.getRepository(FieldAuditPhotoEntity).delete({ id });
  }
}

function columns(input: FaultInput) {
  return {
    zoneTestId: input.zoneTestId ?? null,
    kind: input.kind,
    location: input.location,
    description: input.description ?? '',
    status: input.status ?? 'open',
  };
}

function toFault(r: FieldAuditFaultEntity): FaultRecord {
  return {
    id: r.id,
    auditId: r.auditId,
    zoneTestId: r.zoneTestId,
    kind: r.kind as FaultKind,
    location: r.location,
    description: r.description,
    status: r.status,
  };
}

function toPhoto(r: FieldAuditPhotoEntity): PhotoRecord {
  return {
    id: r.id,
    faultId: r.faultId,
    storageKey: r.storageKey,
    contentType: r.contentType as PhotoType,
    sizeBytes: r.sizeBytes,
    createdAt: r.createdAt,
  };
}
