import { createHash } from 'node:crypto';
import type { DailyUseRepository } from '../../readings/data/daily-use-repository';
import { finished, Transform, type Readable } from 'node:stream';
import type { DataSource } from 'typeorm';
import type { Page } from '@shared/api/page';
import type { ColumnMapping, UploadKind } from '@shared/ingest/upload-kind';
import type { RejectionDto, RowErrorPolicy, UploadDto, UploadResult } from '@shared/uploads/upload';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import { clipText } from '../../../platform/clip-text';
import { logger } from '../../../platform/logger';
import type { FileStore } from '../../../platform/storage/file-store';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { MetersService } from '../../meters/domain/meters-service';
import type { SitesService } from '../../sites/domain/sites-service';
import { INTERVAL_TARGET } from '../data/ingest-targets';
import type { MergeOutcome } from '../data/ingest-writer';
import type { FinishedUpload, UploadRecord, UploadsRepository } from '../data/uploads-repository';
import { conflictRejections } from './conflict-messages';
import { openCsvRows } from './csv-rows';
import { ingestRefsFrom } from './ingest-refs-from';
import { OVERLAP_MAX_MINUTES, withdrawLengthOverlaps } from './interval-overlaps';
import { deriveRegisterVolumes } from './register-volumes';
import { IMPORT_ISOLATION, stageUpload, type Staged } from './stage-upload';
import { RowsRefused, TooLarge, toUploadError } from './upload-errors';

/** A failed upload whose outcome could not be written (MariaDB down) is retried this often, this many times. */
const MARK_FAILED_RETRY_MS = 5_000;
const MARK_FAILED_ATTEMPTS = 60;

/**
 * Pipes the upload into the tap. A source that fails or closes before its end (the client went away, even before
 * this was called) fails the tap with that error, so the parser reading the tap stops instead of waiting forever.
 * The tap's own errors reach the parser through its read side; the listener here only keeps them from being
 * unhandled once nobody reads.
 */
function feedTap(file: Readable, tap: Transform): void {
  tap.on('error', () => undefined);
  finished(file, (err) => {
    if (err) tap.destroy(err);
  });
  file.pipe(tap);
}

export interface IngestRequest {
  fileName: string;
  file: Readable;
  mapping?: ColumnMapping;
  overrides?: Partial<ColumnMapping>;
  kind?: UploadKind;
  replaceConflicts: boolean;
  rowErrors: RowErrorPolicy;
  clientRef?: string;
  apiKeyId?: number;
}

/**
 * Uploads: one file in, streamed through parsing into a stage table, then merged into stored data in one
 * transaction (or not at all). The same bytes sent to the same site again change nothing.
 */
export class UploadsService {
  /** Rows read so far by imports running in this process, for the progress bar. */
  private readonly progress = new Map<number, number>();

  constructor(
    private readonly db: DataSource,
    private readonly repo: UploadsRepository,
    private readonly sites: SitesService,
    private readonly meters: MetersService,
    private readonly audit: AuditRepository,
    private readonly store: FileStore,
    private readonly limits: { maxBytes: number; now?: () => number },
    private readonly dailyUse: DailyUseRepository,
  ) {}

  async ingest(principal: Principal, siteId: number, request: IngestRequest): Promise<UploadResult> {
    const site = await this.sites.requireLevel(principal, siteId, 'contribute');
    const refs = ingestRefsFrom(await this.meters.equipment(siteId));
    const { fileName, replaceConflicts, rowErrors } = request;
    const uploadId = await this.repo.create({
      siteId,
      fileName,
      uploadedBy: principal.userId,
      apiKeyId: request.apiKeyId ?? null,
      clientRef: request.clientRef ?? null,
      options: { replaceConflicts, rowErrors },
    });
    this.progress.set(uploadId, 0);

    // Hash, count and keep the original bytes as they pass; the parser reads the same stream.
    const pending = this.store.begin();
    const hash = createHash('sha256');
    let size = 0;
    const maxBytes = this.limits.maxBytes;
    const tap = new Transform({
      transform(chunk: Buffer, _enc, done) {
        size += chunk.length;
        if (size > maxBytes) return done(new TooLarge());
        hash.update(chunk);
        pending.write(chunk).then(() => done(null, chunk), done);
      },
    });
    feedTap(request.file, tap);

    const qr = this.db.createQueryRunner();
    let staged: Staged | undefined;
    let keptKey: string | null = null;
    try {
      await qr.connect();
      const started = Date.now();
      const stageOptions = {
        timeZone: site.timeZone,
        now: this.limits.now?.() ?? Date.now(),
        mapping: request.mapping,
        overrides: request.overrides,
        kind: request.kind,
        refs,
        onProgress: (rows: number) => this.progress.set(uploadId, rows),
      };
      staged = await stageUpload(qr, await openCsvRows(tap), { ...stageOptions, directUploadId: uploadId });
      const sha256 = hash.digest('hex');
      const earlier = await this.repo.findDoneBySha(siteId, sha256, uploadId);
      if (earlier !== null) {
        if (qr.isTransactionActive) await qr.rollbackTransaction();
        await pending.discard();
        await this.repo.remove(uploadId);
        const upload = await this.dto((await this.repo.get(earlier))!);
        return {
          outcome: 'already-imported',
          upload,
          message:
            `"${fileName}" was already imported as upload #${earlier} on ` +
            `${upload.createdAt.slice(0, 10)}; nothing was changed.`,
        };
      }
      if (rowErrors === 'refuse-file' && staged.rejected > 0) throw new RowsRefused(staged.rejected, staged.rejections);
      const storageKey = await pending.keep(sha256);
      keptKey = storageKey;
      if (staged.direct && staged.staged < staged.writer.linesSent) {
        // Some lines met stored readings (or repeat within the file): undo the fast load and read the kept copy
        // again through the stage, which tells duplicates from conflicts row by row.
        await qr.rollbackTransaction();
        staged = await stageUpload(qr, await openCsvRows(this.store.open(storageKey)), {
          ...stageOptions,
          mapping: staged.mapping,
          overrides: undefined,
          kind: undefined,
        });
      }

      const stagedAt = Date.now();
      let merged: MergeOutcome = { accepted: staged.staged, duplicate: 0, conflicting: 0, replaced: 0, conflicts: [] };
      if (!staged.direct) {
        await qr.startTransaction(IMPORT_ISOLATION);
        merged = await staged.writer.merge(uploadId, replaceConflicts);
      }
      const rejections: RejectionDto[] = [
        ...staged.rejections,
        ...conflictRejections(staged.target, merged, refs, replaceConflicts),
      ];
      if (staged.target === INTERVAL_TARGET && merged.accepted > 0) {
        // After a direct load every line sent was stored: the spans collected while sending are exact.
        const overlaps = await withdrawLengthOverlaps(
          qr,
          uploadId,
          refs,
          staged.direct ? staged.spans?.meterSpans(OVERLAP_MAX_MINUTES) : undefined,
        );
        merged = {
          ...merged,
          accepted: merged.accepted - overlaps.withdrawn,
          conflicting: merged.conflicting + overlaps.withdrawn,
        };
        rejections.push(...overlaps.rejections);
      }
      let rejected = staged.rejected;
      if (staged.kind === 'register') {
        const derived = await deriveRegisterVolumes(qr, staged.writer, refs, uploadId);
        rejections.push(...derived.rejections);
        rejected += derived.problems;
      }
      const counts = {
        rowsRead: staged.rowsRead,
        accepted: merged.accepted,
        duplicate: merged.duplicate,
        conflicting: merged.conflicting,
        replaced: merged.replaced,
        rejected,
      };
      // The daily rollup moves with the readings, in the same transaction.
      // (A direct load's span may include readings withdrawn above; refreshing those days again changes nothing.)
      const span =
        staged.direct && staged.spans ? staged.spans.overall() : await this.dailyUse.uploadSpan(qr.manager, uploadId);
      if (span) await this.dailyUse.refresh(qr.manager, siteId, span.from, span.to);
      await this.repo.insertRejections(qr.manager, uploadId, rejections);
      await this.repo.finish(qr.manager, uploadId, {
        ...counts,
        status: 'done',
        kind: staged.kind,
        sizeBytes: size,
        sha256,
        storageKey,
        mapping: staged.mapping,
        errorSummary: null,
      });
      await this.audit.record(qr.manager, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'upload',
        entityId: uploadId,
        action: 'import',
        changes: { siteId, fileName, ...counts },
      });
      await qr.commitTransaction();
      logger.info('upload imported', {
        uploadId,
        rows: staged.rowsRead,
        stageMs: stagedAt - started,
        mergeMs: Date.now() - stagedAt,
      });
      return { outcome: 'imported', upload: await this.dto((await this.repo.get(uploadId))!) };
    } catch (err) {
      if (qr.isTransactionActive) await qr.rollbackTransaction().catch(() => undefined);
      if (keptKey) await this.removeKeptCopy(keptKey, uploadId);
      else await pending.discard();
      const problem = toUploadError(err, fileName, maxBytes);
      if (!problem) logger.error('upload failed', { uploadId, error: (err as Error).stack ?? String(err) });
      const summary = clipText(
        problem?.message ?? 'The server could not finish this upload; nothing was stored.',
        2_000,
      );
      await this.markFailed(uploadId, {
        status: 'failed',
        kind: staged?.kind ?? null,
        sizeBytes: size,
        sha256: null,
        storageKey: null,
        mapping: staged?.mapping ?? null,
        errorSummary: summary,
        rowsRead: staged?.rowsRead ?? this.progress.get(uploadId) ?? 0,
        accepted: 0,
        duplicate: 0,
        conflicting: 0,
        replaced: 0,
        rejected: staged?.rejected ?? 0,
      });
      if (err instanceof RowsRefused)
        await this.repo.insertRejections(this.db, uploadId, err.rejections).catch(() => undefined);
      throw problem ?? err;
    } finally {
      // Whatever happened, let the rest of the request body flow so the multipart parser can finish.
      request.file.unpipe(tap);
      request.file.resume();
      tap.destroy();
      if (!keptKey) await pending.discard();
      await staged?.writer.drop();
      await qr.release();
      this.progress.delete(uploadId);
    }
  }

  /**
   * Records a failed upload. When MariaDB is what failed, the row is written once it answers again (retried in
   * the background), so the upload does not stay "processing".
   */
  private async markFailed(uploadId: number, outcome: FinishedUpload, attempt = 1): Promise<void> {
    try {
      await this.repo.finish(this.db, uploadId, outcome);
    } catch (err) {
      if (attempt >= MARK_FAILED_ATTEMPTS) {
        logger.error('could not record a failed upload', { uploadId, error: (err as Error).message });
        return;
      }
      if (attempt === 1) logger.warn('failed upload not recorded yet; retrying', { uploadId, error: String(err) });
      setTimeout(() => void this.markFailed(uploadId, outcome, attempt + 1), MARK_FAILED_RETRY_MS).unref();
    }
  }

  /** A failed upload removes the original it had already filed, unless another upload refers to the same bytes. */
  private async removeKeptCopy(storageKey: string, uploadId: number): Promise<void> {
    try {
      if (!(await this.repo.storageKeyInUse(storageKey, uploadId))) await this.store.remove(storageKey);
    } catch (err) {
      logger.warn('kept copy of a failed upload not removed', { uploadId, storageKey, error: String(err) });
    }
  }

  /** A saved mapping of the principal's organisation, to read a file with. */
  async profileMapping(principal: Principal, profileId: number): Promise<ColumnMapping> {
    const profile = (await this.repo.profiles(principal.organisationId)).find((p) => p.id === profileId);
    if (!profile) throw AppError.invalid('profileId', 'no such import profile in your organisation');
    return profile.mapping;
  }

  async get(principal: Principal, uploadId: number): Promise<UploadDto> {
    return this.dto(await this.load(principal, uploadId, 'read'));
  }

  async list(
    principal: Principal,
    siteId: number,
    query: { page: number; pageSize: number; clientRef?: string },
  ): Promise<Page<UploadDto>> {
    await this.sites.requireLevel(principal, siteId, 'read');
    const { items, total } = await this.repo.list(siteId, query);
    return {
      items: await Promise.all(items.map((u) => this.dto(u))),
      total,
      page: query.page,
      pageSize: query.pageSize,
    };
  }

  async rejections(
    principal: Principal,
    uploadId: number,
    page: { offset: number; limit: number },
  ): Promise<{ upload: UploadDto; items: RejectionDto[]; total: number }> {
    const upload = await this.dto(await this.load(principal, uploadId, 'read'));
    return { upload, ...(await this.repo.rejections(uploadId, page)) };
  }

  /** Deletes exactly the rows this upload stored and restores any it replaced. */
  async rollBack(principal: Principal, uploadId: number): Promise<{ upload: UploadDto; removed: number }> {
    const upload = await this.load(principal, uploadId, 'contribute');
    if (upload.status !== 'done')
      throw new AppError(
        'conflict',
        `Upload #${uploadId} is ${upload.status}; only a finished upload can be rolled back.`,
      );
    const removed = await this.db.transaction(IMPORT_ISOLATION, async (em) => {
      const span = await this.dailyUse.uploadSpan(em, uploadId);
      const n = await this.repo.rollBack(em, uploadId);
      if (span) await this.dailyUse.refresh(em, upload.siteId, span.from, span.to);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: upload.organisationId,
        entity: 'upload',
        entityId: uploadId,
        action: 'roll-back',
        changes: { removed: n },
      });
      return n;
    });
    return { upload: await this.dto((await this.repo.get(uploadId))!), removed };
  }

  private async load(principal: Principal, uploadId: number, needed: 'read' | 'contribute'): Promise<UploadRecord> {
    const upload = await this.repo.get(uploadId);
    if (!upload) throw AppError.notFound('Upload');
    await this.sites.requireLevel(principal, upload.siteId, needed).catch((err: AppError) => {
      throw err.status === 404 ? AppError.notFound('Upload') : err;
    });
    return upload;
  }

  private async dto(u: UploadRecord): Promise<UploadDto> {
    const { organisationId: _org, ...rest } = u;
    return { ...rest, progressRows: this.progress.get(u.id) ?? u.rowsRead };
  }
}
