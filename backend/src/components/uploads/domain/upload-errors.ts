import type { RejectionDto } from '@shared/uploads/upload';
import { AppError } from '../../../platform/app-error';
import { clipText } from '../../../platform/clip-text';
import { isDatabaseUnavailable } from '../../../platform/db-errors';
import type { ApiErrorDetail } from '@shared/api/errors';
import { FileProblem } from './csv-rows';

/** The column mapping (detected or sent) cannot read the file; `details` name the fields. */
export class MappingProblem extends FileProblem {
  constructor(
    message: string,
    readonly details: ApiErrorDetail[],
  ) {
    super(message);
  }
}

/** The file went over the configured size limit while streaming. */
export class TooLarge extends Error {}

/** Rows were rejected and the uploader asked to refuse the whole file in that case. */
export class RowsRefused extends Error {
  constructor(
    readonly rejected: number,
    readonly rejections: RejectionDto[],
  ) {
    super(`${rejected} row(s) were rejected`);
  }
}

export function limitMessage(fileName: string, maxBytes: number): string {
  return (
    `"${fileName}" is larger than the upload limit of ${formatMb(maxBytes)} ` +
    '(RILLMARK_UPLOAD_MAX_MB). Split the file by month or ask an ' +
    'administrator to raise the limit.'
  );
}

function formatMb(bytes: number): string {
  const mb = bytes / (1024 * 1024);
  return `${Number.isInteger(mb) ? mb : mb.toFixed(2)} MB`;
}

/** What the person who sent the file is told; `null` for failures that are ours (logged, reported as 500). */
export function toUploadError(err: unknown, fileName: string, maxBytes: number): AppError | null {
  if (err instanceof AppError) return err;
  if (err instanceof TooLarge)
    return new AppError('payload_too_large', limitMessage(fileName, maxBytes), [
      { field: 'file', message: 'is over the size limit' },
    ]);
  // A hostile header can make these messages huge (they quote cells): the answer and the stored summary stay short.
  if (err instanceof MappingProblem)
    return new AppError(
      'validation_failed',
      `"${fileName}": ${clipText(err.message, 2_000)}`,
      err.details.map((d) => ({ ...d, message: clipText(d.message, 500) })),
    );
  if (err instanceof FileProblem)
    return new AppError('validation_failed', `"${fileName}": ${clipText(err.message, 2_000)}`, [
      { field: 'file', message: clipText(err.message, 500) },
    ]);
  if (err instanceof RowsRefused) {
    return new AppError(
      'validation_failed',
      `"${fileName}": ${err.rejected} row(s) were rejected, and the ` +
        'upload was set to refuse the file on any row error, so nothing ' +
        'was stored. The rejected rows are listed with the upload.',
      err.rejections
        .slice(0, 50)
        .map((r) => ({ field: `row ${r.row}${r.column ? `, column ${r.column}` : ''}`, message: r.message })),
    );
  }
  const csv = csvSyntaxError(err);
  if (csv)
    return new AppError(
      'validation_failed',
      `"${fileName}" is not well-formed CSV: ${csv}. Nothing was stored; fix the quoting ` +
        '(a cell that starts with " must end with ") and send the file again.',
      [{ field: 'file', message: csv }],
    );
  if (isClientGone(err))
    return new AppError(
      'validation_failed',
      `"${fileName}": the upload was interrupted before the whole file arrived; nothing was stored.`,
    );
  if (isDatabaseUnavailable(err))
    return new AppError(
      'database_unavailable',
      `"${fileName}": the database stopped answering while this upload was being stored. An upload is stored ` +
        'whole or not at all; send the same file again in a minute (a file that was stored already is recognised ' +
        'and nothing changes).',
    );
  return null;
}

/** The request body ended early: the client went away or the connection dropped (not MariaDB's socket). */
function isClientGone(err: unknown): boolean {
  const e = err as { code?: string; message?: string; fatal?: boolean };
  if (e.fatal) return false;
  return e.message === 'aborted' || e.code === 'ECONNRESET' || e.code === 'ERR_STREAM_PREMATURE_CLOSE';
}

/** csv-parse's own errors (CsvError, codes CSV_…): the file's quoting is broken. Its message names the line. */
function csvSyntaxError(err: unknown): string | null {
  const e = err as { code?: unknown; message?: unknown };
  if (typeof e.code !== 'string' || !e.code.startsWith('CSV_') || typeof e.message !== 'string') return null;
  return clipText(e.message, 300);
}
