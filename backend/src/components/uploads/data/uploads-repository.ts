import type { DataSource, EntityManager } from 'typeorm';
import type { ColumnMapping, UploadKind } from '@shared/ingest/upload-kind';
import type {
  ImportProfileDto,
  RejectionDto,
  RejectionKind,
  UploadCounts,
  UploadDto,
  UploadSiteCounts,
  UploadStatus,
} from '@shared/uploads/upload';
import { affected } from './affected';
import { ImportProfileEntity } from './import-profile.entity';
import { ALL_TARGETS } from './ingest-targets';
import { UploadRejectionEntity } from './upload-rejection.entity';
import { UploadSiteEntity } from './upload-site.entity';
import { UploadEntity } from './upload.entity';

export interface UploadRecord extends Omit<UploadDto, 'progressRows'> {
  organisationId: number;
}

/** Where an upload's rows may go: one site, or (siteId null) the organisation's sites. */
export interface UploadScopeKey {
  siteId: number | null;
  organisationId: number;
}

export interface NewUpload extends UploadScopeKey {
  fileName: string;
  uploadedBy: number | null;
  apiKeyId: number | null;
  clientRef: string | null;
  options: object;
}

export interface FinishedUpload extends UploadCounts {
  status: UploadStatus;
  kind: UploadKind | null;
  sizeBytes: number;
  sha256: string | null;
  storageKey: string | null;
  mapping: ColumnMapping | null;
  errorSummary: string | null;
  unknownRefs: number;
}

const SELECT = `SELECT u.*, COALESCE(u.organisation_id, s.organisation_id) AS org_id, us.display_name AS by_name,
  k.name AS key_name FROM upload u LEFT JOIN site s ON s.id = u.site_id LEFT JOIN user us ON us.id = u.uploaded_by
  LEFT JOIN api_key k ON k.id = u.api_key_id`;

/** A site's list shows its own uploads and the organisation uploads that wrote to it. */
const OF_SITE = `(u.site_id = ? OR (u.site_id IS NULL AND EXISTS (SELECT 1 FROM upload_site x WHERE
  x.upload_id = u.id AND x.site_id = ?)))`;

/** Upload rows, their rejections and the organisation's import profiles. */
export class UploadsRepository {
  constructor(private readonly db: DataSource) {}

  async create(u: NewUpload): Promise<number> {
    const result = await this.db.getRepository(UploadEntity).insert({
      siteId: u.siteId,
      organisationId: u.organisationId,
      fileName: u.fileName.slice(0, 255),
      uploadedBy: u.uploadedBy,
      apiKeyId: u.apiKeyId,
      clientRef: u.clientRef,
      options: JSON.stringify(u.options),
      status: 'processing',
    });
    return Number(result.identifiers[0]!['id']);
  }

  async finish(em: EntityManager | DataSource, id: number, f: FinishedUpload): Promise<void> {
    await em.getRepository(UploadEntity).update(
      { id },
      {
        status: f.status,
        kind: f.kind,
        sizeBytes: String(f.sizeBytes),
        sha256: f.sha256,
        storageKey: f.storageKey,
        mapping: f.mapping ? JSON.stringify(f.mapping) : null,
        errorSummary: f.errorSummary ? f.errorSummary.slice(0, 5000) : null,
        rowsRead: f.rowsRead,
        accepted: f.accepted,
        duplicate: f.duplicate,
        conflicting: f.conflicting,
        replaced: f.replaced,
        rejected: f.rejected,
        unknownRefs: f.unknownRefs,
        finishedAt: new Date(),
      },
    );
  }

  async remove(id: number): Promise<void> {
    await this.db.getRepository(UploadEntity).delete({ id });
  }

  /** True when an upload other than `exceptId` refers to this kept file (so a failed upload must not remove it). */
  async storageKeyInUse(storageKey: string, exceptId: number): Promise<boolean> {
    const [row] = await this.db.query('SELECT 1 AS hit FROM upload WHERE storage_key = ? AND id <> ? LIMIT 1', [
      storageKey,
      exceptId,
    ]);
    return row !== undefined;
  }

  /**
   * The done upload of the same bytes to the same site (or the same organisation), if any: what makes a re-upload
   * a no-op. An upload that left rows of unknown meters aside does not count, so the file can be sent again once
   * the meters exist (what it stored is then only a duplicate).
   */
  async findDoneBySha(scope: UploadScopeKey, sha256: string, exceptId: number): Promise<number | null> {
    const [where, key] =
      scope.siteId === null
        ? ['site_id IS NULL AND organisation_id = ?', scope.organisationId]
        : ['site_id = ?', scope.siteId];
    const [row] = await this.db.query(
      `SELECT id FROM upload WHERE ${where} AND sha256 = ? AND status = 'done' AND unknown_refs = 0 AND id <> ?
        ORDER BY id LIMIT 1`,
      [key, sha256, exceptId],
    );
    return row ? Number(row.id) : null;
  }

  async get(id: number): Promise<UploadRecord | null> {
    const [row] = await this.db.query(`${SELECT} WHERE u.id = ?`, [id]);
    if (!row) return null;
    return toRecord(row, (await this.siteCounts([id])).get(id) ?? []);
  }

  /** A site's uploads (its own and organisation uploads that wrote to it), or an organisation's own uploads. */
  async list(
    scope: UploadScopeKey,
    f: { page: number; pageSize: number; clientRef?: string },
  ): Promise<{ items: UploadRecord[]; total: number }> {
    let where = scope.siteId === null ? 'u.site_id IS NULL AND u.organisation_id = ?' : OF_SITE;
    const params: unknown[] = scope.siteId === null ? [scope.organisationId] : [scope.siteId, scope.siteId];
    if (f.clientRef) {
      where += ' AND u.client_ref = ?';
      params.push(f.clientRef);
    }
    const [count] = await this.db.query(`SELECT COUNT(*) AS n FROM upload u WHERE ${where}`, params);
    const rows = await this.db.query(`${SELECT} WHERE ${where} ORDER BY u.id DESC LIMIT ? OFFSET ?`, [
      ...params,
      f.pageSize,
      f.page * f.pageSize,
    ]);
    const counts = await this.siteCounts(rows.map((r: Record<string, unknown>) => Number(r['id'])));
    return {
      items: rows.map((r: Record<string, unknown>) => toRecord(r, counts.get(Number(r['id'])) ?? [])),
      total: Number(count.n),
    };
  }

  /** What each upload did per site. */
  private async siteCounts(uploadIds: number[]): Promise<Map<number, UploadSiteCounts[]>> {
    const out = new Map<number, UploadSiteCounts[]>();
    if (uploadIds.length === 0) return out;
    const rows: Array<Record<string, unknown>> = await this.db.query(
      `SELECT x.*, s.name AS site_name FROM upload_site x JOIN site s ON s.id = x.site_id WHERE x.upload_id IN (?)
        ORDER BY s.name`,
      [uploadIds],
    );
    for (const r of rows) {
      const id = Number(r['upload_id']);
      if (!out.has(id)) out.set(id, []);
      out.get(id)!.push({
        siteId: Number(r['site_id']),
        siteName: String(r['site_name']),
        accepted: Number(r['accepted']),
        duplicate: Number(r['duplicate']),
        conflicting: Number(r['conflicting']),
        rejected: Number(r['rejected']),
      });
    }
    return out;
  }

  async saveSiteCounts(
    em: EntityManager,
    uploadId: number,
    counts: Omit<UploadSiteCounts, 'siteName'>[],
  ): Promise<void> {
    if (counts.length) await em.getRepository(UploadSiteEntity).insert(counts.map((c) => ({ uploadId, ...c })));
  }

  /** After the fact: readings replaced or stored by a person's choice are added to the upload's counts. */
  async addCounts(em: EntityManager, uploadId: number, add: { accepted?: number; replaced?: number }): Promise<void> {
    await em.query('UPDATE upload SET accepted = accepted + ?, replaced = replaced + ? WHERE id = ?', [
      add.accepted ?? 0,
      add.replaced ?? 0,
      uploadId,
    ]);
  }

  async insertRejections(em: EntityManager | DataSource, uploadId: number, rows: RejectionDto[]): Promise<void> {
    for (let i = 0; i < rows.length; i += 1000) {
      await em.getRepository(UploadRejectionEntity).insert(
        rows.slice(i, i + 1000).map((r) => ({
          uploadId,
          rowNo: r.row,
          columnNo: r.column,
          kind: r.kind,
          message: r.message.slice(0, 500),
          ref: r.ref?.ref.slice(0, 64) ?? null,
          refField: r.ref?.field ?? null,
          refRows: r.ref?.rows ?? null,
        })),
      );
    }
  }

  async rejections(
    uploadId: number,
    page: { offset: number; limit: number; kind?: RejectionKind },
  ): Promise<{ items: RejectionDto[]; total: number }> {
    const where = page.kind ? 'upload_id = ? AND kind = ?' : 'upload_id = ?';
    const params = page.kind ? [uploadId, page.kind] : [uploadId];
    const [count] = await this.db.query(`SELECT COUNT(*) AS n FROM upload_rejection WHERE ${where}`, params);
    const rows = await this.db.query(
      `SELECT row_no, column_no, kind, message, ref, ref_field, ref_rows FROM upload_rejection WHERE ${where}
        ORDER BY row_no, id LIMIT ? OFFSET ?`,
      [...params, page.limit, page.offset],
    );
    return { items: rows.map(toRejection), total: Number(count.n) };
  }

  /** Deletes exactly what the upload wrote and puts back what it replaced. Runs in the caller's transaction. */
  async rollBack(em: EntityManager, uploadId: number): Promise<number> {
    let removed = 0;
    for (const t of ALL_TARGETS)
      removed += affected(await em.query(`DELETE FROM \`${t.table}\` WHERE upload_id = ?`, [uploadId]));
    for (const t of ALL_TARGETS) {
      const columns = [...t.key, ...t.copied, 'upload_id'];
      const values = columns.map((c) => `JSON_VALUE(previous_row, '$.${c}')`).join(', ');
      await em.query(
        `INSERT IGNORE INTO \`${t.table}\` (${columns.map((c) => `\`${c}\``).join(', ')}) SELECT
          ${values} FROM upload_replacement WHERE upload_id = ? AND target_table = ?`,
        [uploadId, t.table],
      );
    }
    await em.getRepository(UploadEntity).update({ id: uploadId }, { status: 'rolled-back' });
    return removed;
  }

  async profiles(organisationId: number): Promise<ImportProfileDto[]> {
    const rows = await this.db
      .getRepository(ImportProfileEntity)
      .find({ where: { organisationId }, order: { name: 'ASC' } });
    return rows.map((p) => ({
      id: p.id,
      name: p.name,
      kind: p.kind,
      mapping: JSON.parse(p.mapping),
      createdAt: p.createdAt.toISOString(),
    }));
  }

  async profileNameTaken(organisationId: number, name: string): Promise<boolean> {
    return !!(await this.db.getRepository(ImportProfileEntity).findOneBy({ organisationId, name }));
  }

  async insertProfile(
    em: EntityManager,
    organisationId: number,
    createdBy: number,
    name: string,
    mapping: ColumnMapping,
  ): Promise<number> {
    const result = await em
      .getRepository(ImportProfileEntity)
      .insert({ organisationId, createdBy, name, kind: mapping.kind, mapping: JSON.stringify(mapping) });
    return Number(result.identifiers[0]!['id']);
  }

  async deleteProfile(em: EntityManager, organisationId: number, id: number): Promise<boolean> {
    return ((await em.getRepository(ImportProfileEntity).delete({ organisationId, id })).affected ?? 0) > 0;
  }
}

function toRejection(r: Record<string, unknown>): RejectionDto {
  const rejection: RejectionDto = {
    row: Number(r['row_no']),
    column: r['column_no'] === null ? null : Number(r['column_no']),
    kind: r['kind'] as RejectionKind,
    message: String(r['message']),
  };
  if (r['ref'] !== null && r['ref'] !== undefined) {
    rejection.ref = {
      field: r['ref_field'] as 'meter' | 'controller',
      ref: String(r['ref']),
      rows: Number(r['ref_rows']),
    };
  }
  return rejection;
}

function toRecord(r: Record<string, unknown>, sites: UploadSiteCounts[]): UploadRecord {
  const date = (v: unknown) => (v ? new Date(v as string).toISOString() : null);
  return {
    id: Number(r['id']),
    siteId: r['site_id'] === null ? null : Number(r['site_id']),
    organisationId: Number(r['org_id']),
    sites,
    unknownRefs: Number(r['unknown_refs']),
    kind: (r['kind'] as UploadKind | null) ?? null,
    fileName: String(r['file_name']),
    sizeBytes: Number(r['size_bytes']),
    sha256: (r['sha256'] as string | null) ?? null,
    status: r['status'] as UploadStatus,
    errorSummary: (r['error_summary'] as string | null) ?? null,
    mapping: r['mapping'] ? JSON.parse(String(r['mapping'])) : null,
    uploadedBy: (r['by_name'] as string | null) ?? null,
    viaApiKey: (r['key_name'] as string | null) ?? null,
    createdAt: date(r['created_at'])!,
    finishedAt: date(r['finished_at']),
    rowsRead: Number(r['rows_read']),
    accepted: Number(r['accepted']),
    duplicate: Number(r['duplicate']),
    conflicting: Number(r['conflicting']),
    replaced: Number(r['replaced']),
    rejected: Number(r['rejected']),
  };
}
