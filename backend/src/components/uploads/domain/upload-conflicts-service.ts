import type { DataSource, EntityManager } from 'typeorm';
import type { ConflictSummaryDto, RepeatChoice, UploadDto } from '@shared/uploads/upload';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { DailyUseRepository } from '../../readings/data/daily-use-repository';
import type { ConflictScope, ConflictsRepository, SiteSpan } from '../data/conflicts-repository';
import type { UploadsRepository } from '../data/uploads-repository';
import { IMPORT_ISOLATION } from './pipeline/stage';
import type { UploadsService } from './uploads-service';

/**
 * What an upload left for a person to decide about its interval readings, after the fact: readings that differ from
 * stored ones ("replace these N readings", all or one day at a time) and readings the file gave twice with
 * different values (keep the first, the last, or add them up). Each action is one transaction with the rollups
 * and an audit entry; rolling the upload back undoes it.
 */
export class UploadConflictsService {
  constructor(
    private readonly deps: {
      db: DataSource;
      uploads: UploadsService;
      repo: UploadsRepository;
      conflicts: ConflictsRepository;
      dailyUse: DailyUseRepository;
      audit: AuditRepository;
    },
  ) {}

  async summary(principal: Principal, uploadId: number): Promise<ConflictSummaryDto> {
    await this.deps.uploads.load(principal, uploadId, 'read');
    const em = this.deps.db.manager;
    return { days: await this.deps.conflicts.days(em, uploadId), open: await this.deps.conflicts.open(em, uploadId) };
  }

  /** Replaces the stored readings with the file's values (one site's day, or every open conflict). */
  async replace(
    principal: Principal,
    uploadId: number,
    day?: { siteId: number; date: string },
  ): Promise<{ replaced: number; upload: UploadDto }> {
    const scope: ConflictScope = { uploadId, kind: 'stored', day };
    const replaced = await this.act(principal, scope, 'replace-conflicts', async (em) => {
      const n = await this.deps.conflicts.replace(em, scope);
      await this.deps.repo.addCounts(em, uploadId, { replaced: n });
      return n;
    });
    return { replaced, upload: this.deps.uploads.dto((await this.deps.repo.get(uploadId))!) };
  }

  /** Stores one value for every reading the file gave twice with different values. */
  async resolveRepeats(
    principal: Principal,
    uploadId: number,
    choice: RepeatChoice,
  ): Promise<{ stored: number; upload: UploadDto }> {
    const scope: ConflictScope = { uploadId, kind: 'in-file' };
    const stored = await this.act(principal, scope, `repeats-${choice}`, async (em) => {
      const n = await this.deps.conflicts.resolveRepeats(em, uploadId, choice);
      await this.deps.repo.addCounts(em, uploadId, { accepted: n });
      return n;
    });
    return { stored, upload: this.deps.uploads.dto((await this.deps.repo.get(uploadId))!) };
  }

  private async act(
    principal: Principal,
    scope: ConflictScope,
    action: string,
    change: (em: EntityManager) => Promise<number>,
  ): Promise<number> {
    const upload = await this.deps.uploads.load(principal, scope.uploadId, 'contribute');
    if (upload.status !== 'done')
      throw new AppError(
        'conflict',
        `Upload #${upload.id} is ${upload.status}; its conflicts can no longer be acted on.`,
      );
    return this.deps.db.transaction(IMPORT_ISOLATION, async (em) => {
      const spans: SiteSpan[] = await this.deps.conflicts.spans(em, scope);
      if (spans.length === 0) throw new AppError('conflict', 'There is nothing left to decide here.');
      const n = await change(em);
      for (const span of spans) await this.deps.dailyUse.refresh(em, span.siteId, span.from, span.to);
      await this.deps.audit.record(em, {
        userId: principal.userId,
        organisationId: upload.organisationId,
        entity: 'upload',
        entityId: upload.id,
        action,
        changes: { readings: n, ...(scope.day ?? {}) },
      });
      return n;
    });
  }
}
