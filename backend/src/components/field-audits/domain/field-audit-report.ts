import type { Readable } from 'node:stream';
import type { Principal } from '../../../platform/auth/principal';
import type { FileStore } from '../../../platform/storage/file-store';
import type { FaultsRepository } from '../data/faults-repository';
import type { FieldAuditsService } from './field-audits-service';
import { fieldAuditPdf, type PhotoBytes } from './field-audit-pdf';

const PHOTOS_PER_FAULT_IN_PDF = 3;

/** The audit report PDF, with up to three JPEG or PNG photos per fault (pdfkit cannot embed WebP). */
export class FieldAuditReport {
  constructor(
    private readonly audits: FieldAuditsService,
    private readonly faults: FaultsRepository,
    private readonly store: FileStore,
  ) {}

  async pdf(principal: Principal, auditId: number): Promise<Buffer> {
    const audit = await this.audits.get(principal, auditId);
    const records = await this.faults.photosOf(audit.faults.map((f) => f.id));
    const chosen = audit.faults.flatMap((f) =>
      records.filter((p) => p.faultId === f.id && p.contentType !== 'image/webp').slice(0, PHOTOS_PER_FAULT_IN_PDF),
    );
    const photos: PhotoBytes = new Map();
    for (const p of chosen) photos.set(p.id, await readAll(this.store.open(p.storageKey)));
    return fieldAuditPdf(audit, photos);
  }
}

async function readAll(stream: Readable): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}
