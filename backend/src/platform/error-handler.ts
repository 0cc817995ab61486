import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ApiErrorBody } from '@shared/api/errors';
import { AppError } from './app-error';
import { logger } from './logger';

const DB_DOWN_CODES = new Set(['ECONNREFUSED', 'PROTOCOL_CONNECTION_LOST', 'ETIMEDOUT', 'ER_CON_COUNT_ERROR']);

/** Turns anything thrown in a route into the API's one JSON error shape. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const appError = toAppError(err);
  if (appError.status >= 500) logger.error('request failed', { method: req.method, url: req.originalUrl, error: describe(err) });
  const body: ApiErrorBody = { error: { code: appError.code, message: appError.message } };
  if (appError.details?.length) body.error.details = appError.details;
  res.status(appError.status).json(body);
};

export const notFoundHandler: RequestHandler = (req) => {
  throw new AppError('not_found', `No API route ${req.method} ${req.path}.`);
};

function toAppError(err: unknown): AppError {
  if (err instanceof AppError) return err;
  const e = err as { type?: string; status?: number; code?: string; errno?: number; message?: string; driverError?: { code?: string } };
  if (e?.type === 'entity.parse.failed') return new AppError('validation_failed', 'The request body is not valid JSON.');
  if (e?.type === 'entity.too.large') return new AppError('payload_too_large', 'The request body is too large.');
  const code = e?.driverError?.code ?? e?.code;
  if (code === 'ER_DUP_ENTRY') return new AppError('conflict', 'A record with the same unique value already exists.');
  if (code && DB_DOWN_CODES.has(code)) return new AppError('database_unavailable', 'The database is not reachable; try again shortly.');
  return new AppError('internal_error', 'Something went wrong on the server.');
}

function describe(err: unknown): string {
  return err instanceof Error ? `${err.name}: ${err.message}\n${err.stack ?? ''}` : String(err);
}
