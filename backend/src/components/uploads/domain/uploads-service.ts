import type { Readable } from 'node:stream';
import type { DataSource, QueryRunner } from 'typeorm';
import type { Page } from '@shared/api/page';
import type { DateOrder } from '@shared/ingest/date-order';
import type { ColumnMapping, UploadKind } from '@shared/ingest/upload-kind';
import type {
  InFileRepeatPolicy,
  RejectionDto,
  RejectionKind,
  RowErrorPolicy,
  UploadDto,
  UploadResult,
} from '@shared/uploads/upload';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import { clipText } from '../../../platform/clip-text';
import { logger } from '../../../platform/logger';
import type { FileStore } from '../../../platform/storage/file-store';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { MetersService } from '../../meters/domain/meters-service';
import type { OrganisationSettingsService } from '../../organisations/domain/organisation-settings-service';
import type { DailyUseRepository } from '../../readings/data/daily-use-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import { BillingPeriodsRepository } from '../data/billing-periods-repository';
import { IntervalOverlapsRepository } from '../data/interval-overlaps-repository';
import { RegisterReadsRepository } from '../data/register-reads-repository';
import type { FinishedUpload, UploadRecord, UploadsRepository } from '../data/uploads-repository';
import type { DailyEto } from './billing-periods';
import { openCsvRows } from './csv-rows';
import { decideStaged, type Decision } from './pipeline/decide';
import { mergeStaged, type MergeDeps } from './pipeline/merge';
import { receiveBytes, type Received } from './pipeline/receive';
import { recordUpload } from './pipeline/record';
import { IMPORT_ISOLATION, stageFile, type Staged, type StageOptions } from './pipeline/stage';
import { RowsRefused, toUploadError } from './upload-errors';
import { resolveScope, type IngestScope, type UploadTarget } from './upload-scope';

/** A failed upload whose outcome could not be written (MariaDB down) is retried this often, this many times. */
const MARK_FAILED_RETRY_MS = 5_000;
const MARK_FAILED_ATTEMPTS = 60;

export interface IngestRequest {
  fileName: string;
  file: Readable;
  mapping?: ColumnMapping;
  overrides?: Partial<ColumnMapping>;
  kind?: UploadKind;
  replaceConflicts: boolean;
  rowErrors: RowErrorPolicy;
  repeats: InFileRepeatPolicy;
  dateOrder?: DateOrder;
  clientRef?: string;
  apiKey?: { id: number; siteIds: number[] };
}

export interface UploadsServiceDeps {
  db: DataSource;
  repo: UploadsRepository;
  sites: SitesService;
  meters: MetersService;
  organisations: OrganisationSettingsService;
  audit: AuditRepository;
  store: FileStore;
  limits: { maxBytes: number; now?: () => number };
  dailyUse: DailyUseRepository;
  dailyEto: DailyEto;
}

/** One upload on its way through the pipeline. */
interface Run {
  uploadId: number;
  principal: Principal;
  scope: IngestScope;
  request: IngestRequest;
  received: Received;
  stageOptions: StageOptions;
  staged?: Staged;
}

/**
 * Uploads: one file in, through named steps — receive (hash, keep a copy), stage (parse rows into a stage table),
 * decide (what the whole file says: date order, units, unknown meters), merge (against stored data), record
 * (rollups, rows needing attention, counts) — in one transaction, or not at all. The same bytes sent to the same
 * site (or organisation) again change nothing.
 */
export class UploadsService {
  /** Rows read so far by imports running in this process, for the progress bar. */
  private readonly progress = new Map<number, number>();
  private readonly mergeDeps: MergeDeps;

  constructor(private readonly deps: UploadsServiceDeps) {
    this.mergeDeps = {
      overlaps: new IntervalOverlapsRepository(),
      registerReads: new RegisterReadsRepository(),
      billing: new BillingPeriodsRepository(),
      recordSwap: (em, meterId, swap) => deps.meters.recordSwapFromUpload(em, meterId, swap),
      dailyEto: deps.dailyEto,
    };
  }

  async ingest(principal: Principal, target: UploadTarget, request: IngestRequest): Promise<UploadResult> {
    const { repo, db } = this.deps;
    const scope = await resolveScope(this.deps, principal, target, request.apiKey?.siteIds);
    const uploadId = await repo.create({
      ...scope.key,
      fileName: request.fileName,
      uploadedBy: principal.userId,
      apiKeyId: request.apiKey?.id ?? null,
      clientRef: request.clientRef ?? null,
      options: { replaceConflicts: request.replaceConflicts, rowErrors: request.rowErrors, repeats: request.repeats },
    });
    this.progress.set(uploadId, 0);
    const received = receiveBytes(request.file, this.deps.store, this.deps.limits.maxBytes);
    const run: Run = {
      uploadId,
      principal,
      scope,
      request,
      received,
      stageOptions: await this.stageOptions(principal, scope, request, uploadId),
    };
    const qr = db.createQueryRunner();
    try {
      await qr.connect();
      return await this.runPipeline(qr, run);
    } catch (err) {
      throw await this.fail(qr, run, err);
    } finally {
      received.release();
      await received.discard();
      await run.staged?.table.drop();
      await qr.release();
      this.progress.delete(uploadId);
    }
  }

  private async stageOptions(
    principal: Principal,
    scope: IngestScope,
    request: IngestRequest,
    uploadId: number,
  ): Promise<StageOptions> {
    return {
      timeZone: scope.timeZone,
      zoneOf: scope.zoneOf,
      now: this.deps.limits.now?.() ?? Date.now(),
      mapping: request.mapping,
      overrides: request.overrides,
      kind: request.kind,
      refs: scope.refs,
      dateOrder: {
        chosen: request.dateOrder ?? request.mapping?.dateOrder,
        organisationDefault: await this.deps.organisations.usualDateOrder(principal.organisationId),
      },
      onProgress: (rows) => this.progress.set(uploadId, rows),
      directUploadId: uploadId,
    };
  }

  private decide(run: Run, staged: Staged): Decision {
    return decideStaged(
      {
        direct: staged.direct,
        staged: staged.staged,
        linesSent: staged.table.linesSent,
        readOrder: staged.mapping.dateOrder,
        dateEvidence: staged.dateEvidence,
        unknownRefs: staged.unknownRefs,
        units: staged.units,
      },
      {
        fileName: run.request.fileName,
        choices: run.stageOptions.dateOrder,
        refs: run.scope.refs,
        organisationWide: run.scope.key.siteId === null,
      },
    );
  }

  private async runPipeline(qr: QueryRunner, run: Run): Promise<UploadResult> {
    const { repo } = this.deps;
    run.staged = await stageFile(qr, await openCsvRows(run.received.bytes), run.stageOptions);
    const sha256 = run.received.sha256();
    const earlier = await repo.findDoneBySha(run.scope.key, sha256, run.uploadId);
    if (earlier !== null) return this.alreadyImported(qr, run, earlier);
    let decision = this.decide(run, run.staged);
    if (decision.action === 'refuse') throw decision.error;
    if (decision.action === 'merge') this.assertRowsAccepted(run, run.staged, decision);
    const storageKey = await run.received.keep(sha256);
    for (let pass = 0; decision.action === 'restage' && pass < 2; pass++) {
      run.staged = await this.restage(qr, run, storageKey, decision.dateOrder);
      decision = this.decide(run, run.staged);
      if (decision.action === 'refuse') throw decision.error;
    }
    if (decision.action !== 'merge') throw new Error(`upload #${run.uploadId} did not settle after reading it again`);
    const staged = run.staged;
    this.assertRowsAccepted(run, staged, decision);
    const stagedAt = Date.now();
    const merged = await mergeStaged(
      qr,
      staged,
      {
        uploadId: run.uploadId,
        refs: run.scope.refs,
        replaceConflicts: run.request.replaceConflicts,
        repeats: run.request.repeats,
        zoneOfSite: run.scope.zoneOfSite,
      },
      this.mergeDeps,
    );
    await recordUpload(
      qr.manager,
      {
        uploadId: run.uploadId,
        principal: run.principal,
        organisationId: run.scope.key.organisationId,
        siteId: run.scope.key.siteId,
        fileName: run.request.fileName,
        refs: run.scope.refs,
        staged,
        merged,
        notices: [...decision.notices, ...decision.unknown],
        file: { sizeBytes: run.received.size(), sha256, storageKey },
      },
      this.deps,
    );
    await qr.commitTransaction();
    logger.info('upload imported', { uploadId: run.uploadId, rows: staged.rowsRead, mergeMs: Date.now() - stagedAt });
    return { outcome: 'imported', upload: await this.dto((await repo.get(run.uploadId))!) };
  }

  /** `rowErrors=refuse-file`: any rejected row refuses the whole file. */
  private assertRowsAccepted(run: Run, staged: Staged, decision: Extract<Decision, { action: 'merge' }>): void {
    if (run.request.rowErrors === 'refuse-file' && staged.rejected > 0) {
      throw new RowsRefused(staged.rejected, [...decision.unknown, ...staged.rejections]);
    }
  }

  /**
   * Reads the kept copy again through the stage: when a direct load met stored readings (or repeats), or when the
   * whole file showed another date order than the one its first rows were read with.
   */
  private async restage(qr: QueryRunner, run: Run, storageKey: string, dateOrder?: DateOrder): Promise<Staged> {
    if (qr.isTransactionActive) await qr.rollbackTransaction();
    await run.staged!.table.drop();
    const { dateOrder: _used, ...mapping } = run.staged!.mapping;
    const read = dateOrder ?? run.staged!.mapping.dateOrder;
    return stageFile(qr, await openCsvRows(this.deps.store.open(storageKey)), {
      ...run.stageOptions,
      mapping: read ? { ...mapping, dateOrder: read } : mapping,
      overrides: undefined,
      kind: undefined,
      dateOrder: { ...run.stageOptions.dateOrder, read },
      directUploadId: undefined,
    });
  }

  private async alreadyImported(qr: QueryRunner, run: Run, earlier: number): Promise<UploadResult> {
    if (qr.isTransactionActive) await qr.rollbackTransaction();
    await run.received.discard();
    await this.deps.repo.remove(run.uploadId);
    const upload = await this.dto((await this.deps.repo.get(earlier))!);
    return {
      outcome: 'already-imported',
      upload,
      message:
        `"${run.request.fileName}" was already imported as upload #${earlier} on ` +
        `${upload.createdAt.slice(0, 10)}; nothing was changed.`,
    };
  }

  /**
   * Rolls back, throws the copy away (or removes the one it had filed), records the failure once, and says what
   * went wrong.
   */
  private async fail(qr: QueryRunner, run: Run, err: unknown): Promise<unknown> {
    if (qr.isTransactionActive) await qr.rollbackTransaction().catch(() => undefined);
    const keptKey = run.received.keptKey();
    if (keptKey) await this.removeKeptCopy(keptKey, run.uploadId);
    else await run.received.discard();
    const maxBytes = this.deps.limits.maxBytes;
    const problem = toUploadError(err, run.request.fileName, maxBytes);
    if (!problem) logger.error('upload failed', { uploadId: run.uploadId, error: (err as Error).stack ?? String(err) });
    const staged = run.staged;
    await this.markFailed(run.uploadId, {
      status: 'failed',
      kind: staged?.kind ?? null,
      sizeBytes: run.received.size(),
      sha256: null,
      storageKey: null,
      mapping: staged?.mapping ?? null,
      errorSummary: clipText(problem?.message ?? 'The server could not finish this upload; nothing was stored.', 2_000),
      rowsRead: staged?.rowsRead ?? this.progress.get(run.uploadId) ?? 0,
      accepted: 0,
      duplicate: 0,
      conflicting: 0,
      replaced: 0,
      rejected: staged?.rejected ?? 0,
      unknownRefs: staged?.unknownRefs.size ?? 0,
    });
    if (err instanceof RowsRefused)
      await this.deps.repo.insertRejections(this.deps.db, run.uploadId, err.rejections).catch(() => undefined);
    return problem ?? err;
  }

  /**
   * Records a failed upload. When MariaDB is what failed, the row is written once it answers again (retried in
   * the background), so the upload does not stay "processing".
   */
  private async markFailed(uploadId: number, outcome: FinishedUpload, attempt = 1): Promise<void> {
    try {
      await this.deps.repo.finish(this.deps.db, uploadId, outcome);
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
      if (!(await this.deps.repo.storageKeyInUse(storageKey, uploadId))) await this.deps.store.remove(storageKey);
    } catch (err) {
      logger.warn('kept copy of a failed upload not removed', { uploadId, storageKey, error: String(err) });
    }
  }

  /** A saved mapping of the principal's organisation, to read a file with. */
  async profileMapping(principal: Principal, profileId: number): Promise<ColumnMapping> {
    const profile = (await this.deps.repo.profiles(principal.organisationId)).find((p) => p.id === profileId);
    if (!profile) throw AppError.invalid('profileId', 'no such import profile in your organisation');
    return profile.mapping;
  }

  async get(principal: Principal, uploadId: number): Promise<UploadDto> {
    return this.dto(await this.load(principal, uploadId, 'read'));
  }

  /** A site's uploads (with the organisation uploads that wrote to it), or (siteId null) the organisation's own. */
  async list(
    principal: Principal,
    siteId: number | null,
    query: { page: number; pageSize: number; clientRef?: string },
  ): Promise<Page<UploadDto>> {
    if (siteId !== null) await this.deps.sites.requireLevel(principal, siteId, 'read');
    const { items, total } = await this.deps.repo.list({ siteId, organisationId: principal.organisationId }, query);
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
    page: { offset: number; limit: number; kind?: RejectionKind },
  ): Promise<{ upload: UploadDto; items: RejectionDto[]; total: number }> {
    const upload = await this.dto(await this.load(principal, uploadId, 'read'));
    return { upload, ...(await this.deps.repo.rejections(uploadId, page)) };
  }

  /** Deletes exactly the rows this upload stored, restores any it replaced, and undoes swaps it recorded. */
  async rollBack(principal: Principal, uploadId: number): Promise<{ upload: UploadDto; removed: number }> {
    const upload = await this.load(principal, uploadId, 'contribute');
    if (upload.status !== 'done')
      throw new AppError(
        'conflict',
        `Upload #${uploadId} is ${upload.status}; only a finished upload can be rolled back.`,
      );
    const { dailyUse, repo, audit, meters } = this.deps;
    const removed = await this.deps.db.transaction(IMPORT_ISOLATION, async (em) => {
      const spans = await dailyUse.uploadSpansBySite(em, uploadId);
      const n = await repo.rollBack(em, uploadId);
      await meters.undoUploadSwaps(em, uploadId);
      for (const span of spans) await dailyUse.refresh(em, span.siteId, span.from, span.to);
      await audit.record(em, {
        userId: principal.userId,
        organisationId: upload.organisationId,
        entity: 'upload',
        entityId: uploadId,
        action: 'roll-back',
        changes: { removed: n },
      });
      return n;
    });
    return { upload: await this.dto((await repo.get(uploadId))!), removed };
  }

  /**
   * An upload the principal may see: a site's through that site; an organisation's by its organisation, and, for
   * changes, only when the principal may contribute to every site it wrote to.
   */
  async load(principal: Principal, uploadId: number, needed: 'read' | 'contribute'): Promise<UploadRecord> {
    const upload = await this.deps.repo.get(uploadId);
    if (!upload) throw AppError.notFound('Upload');
    const siteIds = upload.siteId !== null ? [upload.siteId] : upload.sites.map((s) => s.siteId);
    if (upload.siteId === null && upload.organisationId !== principal.organisationId) throw AppError.notFound('Upload');
    for (const siteId of upload.siteId === null && needed === 'read' ? [] : siteIds) {
      await this.deps.sites.requireLevel(principal, siteId, needed).catch((err: AppError) => {
        throw err.status === 404 ? AppError.notFound('Upload') : err;
      });
    }
    return upload;
  }

  dto(u: UploadRecord): UploadDto {
    const { organisationId: _org, ...rest } = u;
    return { ...rest, progressRows: this.progress.get(u.id) ?? u.rowsRead };
  }
}
