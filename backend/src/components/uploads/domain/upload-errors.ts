import type { RejectionDto } from '@shared/uploads/upload';
import { AppError } from '../../../platform/app-error';
import { FileProblem } from './csv-rows';
import { MappingProblem } from './stage-upload';

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
  if (err instanceof MappingProblem)
    return new AppError('validation_failed', `"${fileName}": ${err.message}`, err.details);
  if (err instanceof FileProblem)
    return new AppError('validation_failed', `"${fileName}": ${err.message}`, [
      { field: 'file', message: err.message },
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
  const code = (err as { code?: string }).code;
  if (code === 'ECONNRESET' || (err as Error).message === 'aborted')
    return new AppError(
      'validation_failed',
      `"${fileName}": the upload was interrupted before the whole file arrived; nothing was stored.`,
    );
  return null;
}
