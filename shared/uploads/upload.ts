/** Uploads, their reports, import profiles and API keys as the API carries them. Pure types and constants. */
import type { ColumnMapping, UploadKind } from '../ingest/upload-kind';

export type { DateOrder } from '../ingest/date-order';

export const UPLOAD_STATUSES = ['processing', 'done', 'failed', 'rolled-back'] as const;
export type UploadStatus = (typeof UPLOAD_STATUSES)[number];

/**
 * What to do when some rows are rejected. `keep-valid` (the default) stores the valid rows and lists the rest;
 * `refuse-file` stores nothing when any row is rejected.
 */
export const ROW_ERROR_POLICIES = ['keep-valid', 'refuse-file'] as const;
export type RowErrorPolicy = (typeof ROW_ERROR_POLICIES)[number];

/**
 * A reading the file gives twice with different values: `not-stored` (the default) lists it and stores neither;
 * or keep the first row's value, the last row's, or add them up (exports that split an interval over two rows).
 * Same values twice are always stored once.
 */
export const IN_FILE_REPEAT_POLICIES = ['not-stored', 'keep-first', 'keep-last', 'sum'] as const;
export type InFileRepeatPolicy = (typeof IN_FILE_REPEAT_POLICIES)[number];
export type RepeatChoice = Exclude<InFileRepeatPolicy, 'not-stored'>;

export interface UploadCounts {
  /** Data rows read from the file (the header excluded). */
  rowsRead: number;
  /** Readings (or runs, or register reads) stored by this upload. */
  accepted: number;
  /** Already stored, or given earlier in the same file, with the same value: stored once. */
  duplicate: number;
  /**
   * Already stored with a different value (reported, and left as they were unless replacing was chosen), or given
   * twice in the file with different values (listed with both rows; stored only as chosen).
   */
  conflicting: number;
  /** Conflicts whose stored value this upload replaced. */
  replaced: number;
  /** Rows (or cells of one-row-per-day files) that could not be read; each is listed with its reason. */
  rejected: number;
}

/** What one upload did to one site. */
export interface UploadSiteCounts {
  siteId: number;
  siteName: string;
  accepted: number;
  duplicate: number;
  conflicting: number;
  rejected: number;
}

export interface UploadDto extends UploadCounts {
  id: number;
  /** Null for an organisation's upload, whose rows went to the sites their meters belong to (`sites`). */
  siteId: number | null;
  /** Per site the upload touched (one entry for a site's own upload once it has finished). */
  sites: UploadSiteCounts[];
  /** Distinct meter/controller refs no site has; their rows are listed once per ref (`kind: 'unknown'`). */
  unknownRefs: number;
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

/** `unknown`: the rows of one meter/controller ref no site has, listed once (`ref`). */
export const REJECTION_KINDS = ['rejected', 'conflict', 'notice', 'unknown'] as const;
export type RejectionKind = (typeof REJECTION_KINDS)[number];

export interface RejectionDto {
  /** 1-based row as a spreadsheet shows it (the header is row 1); 0 when the problem is not tied to one row. */
  row: number;
  /** 1-based column, or null. */
  column: number | null;
  kind: RejectionKind;
  message: string;
  /** With `kind: 'unknown'`: the ref, what it names, and how many rows carried it. */
  ref?: { field: 'meter' | 'controller'; ref: string; rows: number };
}

/** Conflicts an upload left for later, per local day of the site (interval readings only). */
export interface ConflictDayDto {
  date: string;
  siteId: number;
  /** `stored`: the file disagrees with stored readings; `in-file`: the file gives the reading twice, differently. */
  kind: 'stored' | 'in-file';
  /** Readings (intervals) concerned. */
  readings: number;
  /** Gallons stored now for those readings (null for in-file repeats: nothing is stored). */
  storedGallons: number | null;
  /** Gallons the file gives (in-file: its first rows' values). */
  fileGallons: number;
}

export interface ConflictSummaryDto {
  days: ConflictDayDto[];
  /** Readings still open: replaceable (`stored`) and to choose a value for (`inFile`). */
  open: { stored: number; inFile: number };
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
