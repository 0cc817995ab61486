import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ApiErrorBody } from '@shared/api/errors';
import { AppError } from './app-error';
import { isDatabaseUnavailable } from './db-errors';
import { logger } from './logger';

/** Turns anything thrown in a route into the API's one JSON error shape. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (res.headersSent) {
    // Already answered (e.g. a 503 sent when MariaDB stopped answering), or failed halfway through a streamed
    // answer: nothing more can be said; cut a half-sent answer off so the client does not wait for the rest.
    if (!res.writableEnded) res.destroy();
    logger.debug('error after the answer was sent', { url: req.originalUrl, error: describe(err) });
    return;
  }
  const appError = toAppError(err);
  if (appError.status >= 500)
    logger.error('request failed', { method: req.method, url: req.originalUrl, error: describe(err) });
  const body: ApiErrorBody = { error: { code: appError.code, message: appError.message } };
  if (appError.details?.length) body.error.details = appError.details;
  const send = () => {
    if (res.headersSent) return;
    if (appError.retryAfterSeconds !== undefined) res.set('Retry-After', String(appError.retryAfterSeconds));
    res.status(appError.status).json(body);
  };
  // Refused before its body was read (e.g. an upload with a revoked key): take in the rest of a small body
  // first, so the client finishes sending and reads the answer instead of a reset connection. Large or
  // stalled bodies get the answer at once.
  const pending = Number(req.headers['content-length'] ?? 0);
  // Only a body nobody has started reading: one piped into an upload parser belongs to it (resuming it would
  // push data into a file stream that the failed upload already closed).
  if (!req.complete && !req.destroyed && req.readableFlowing === null && pending > 0 && pending <= DRAIN_LIMIT_BYTES) {
    const timer = setTimeout(send, 2_000);
    req.on('end', () => {
      clearTimeout(timer);
      send();
    });
    req.on('error', () => {
      clearTimeout(timer);
      send();
    });
    req.resume();
    return;
  }
  send();
};

/** Bodies up to this size are read to the end before an early error answer. */
const DRAIN_LIMIT_BYTES = 1024 * 1024;

export const notFoundHandler: RequestHandler = (req) => {
  throw new AppError('not_found', `No API route ${req.method} ${req.path}.`);
};

function toAppError(err: unknown): AppError {
  if (err instanceof AppError) return err;
  const e = err as {
    type?: string;
    status?: number;
    code?: string;
    errno?: number;
    message?: string;
    driverError?: { code?: string };
  };
  if (e?.type === 'entity.parse.failed')
    return new AppError('validation_failed', 'The request body is not valid JSON.');
  if (e?.type === 'entity.too.large') return new AppError('payload_too_large', 'The request body is too large.');
  const code = e?.driverError?.code ?? e?.code;
  if (code === 'ER_DUP_ENTRY') return new AppError('conflict', 'A record with the same unique value already exists.');
  if (isDatabaseUnavailable(err))
    return new AppError(
      'database_unavailable',
      'The database is not answering right now; try again in a minute. ' +
        'A change you sent may not have been saved: check before sending it again.',
    );
  return new AppError('internal_error', 'Something went wrong on the server.');
}

function describe(err: unknown): string {
  return err instanceof Error ? `${err.name}: ${err.message}\n${err.stack ?? ''}` : String(err);
}
