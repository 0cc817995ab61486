/** Uploads, their reports, import profiles and API keys as the API carries them. Pure types and constants. */
import type { ColumnMapping, UploadKind } from '../ingest/upload-kind';

export const UPLOAD_STATUSES = ['processing', 'done', 'failed', 'rolled-back'] as const;
export type UploadStatus = (typeof UPLOAD_STATUSES)[number];

/**
 * What to do when some rows are rejected. `keep-valid` (the default) stores the valid rows and lists the rest;
 * `refuse-file` stores nothing when any row is rejected.
 */
export const ROW_ERROR_POLICIES = ['keep-valid', 'refuse-file'] as const;
export type RowErrorPolicy = (typeof ROW_ERROR_POLICIES)[number];

export interface UploadCounts {
  /** Data rows read from the file (the header excluded). */
  rowsRead: number;
  /** Readings (or runs, or register reads) stored by this upload. */
  accepted: number;
  /** Already stored with the same value: left as they were. */
  duplicate: number;
  /** Already stored with a different value: reported, and left as they were unless replacing was chosen. */
  conflicting: number;
  /** Conflicts whose stored value this upload replaced. */
  replaced: number;
  /** Rows (or cells of one-row-per-day files) that could not be read; each is listed with its reason. */
  rejected: number;
}

export interface UploadDto extends UploadCounts {
  id: number;
  siteId: number;
  kind: UploadKind | null;
  fileName: string;
  sizeBytes: number;
  sha256: string | null;
  status: UploadStatus;
  errorSummary: string | null;
  mapping: ColumnMapping | null;
  uploadedBy: string | null;
  viaApiKey: string | null;
  createdAt: string;
  finishedAt: string | null;
  /** While processing: rows read so far (from the running import). */
  progressRows: number;
}

/** The answer to a POST of a file: the upload, or the earlier upload of the same file. */
export type UploadResult =
  { outcome: 'imported'; upload: UploadDto } | { outcome: 'already-imported'; upload: UploadDto; message: string };

export const REJECTION_KINDS = ['rejected', 'conflict', 'notice'] as const;
export type RejectionKind = (typeof REJECTION_KINDS)[number];

export interface RejectionDto {
  /** 1-based row as a spreadsheet shows it (the header is row 1); 0 when the problem is not tied to one row. */
  row: number;
  /** 1-based column, or null. */
  column: number | null;
  kind: RejectionKind;
  message: string;
}

export interface ImportProfileDto {
  id: number;
  name: string;
  kind: UploadKind;
  mapping: ColumnMapping;
  createdAt: string;
}

export interface ApiKeyDto {
  id: number;
  name: string;
  /** The public part, shown so people can tell keys apart (`rk_ab12cd34…`). */
  prefix: string;
  siteIds: number[];
  createdBy: string | null;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

/** Returned once, when the key is made: the secret is not stored and cannot be shown again. */
export interface NewApiKeyDto extends ApiKeyDto {
  secret: string;
}
