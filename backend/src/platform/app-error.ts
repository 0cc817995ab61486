import type { ApiErrorCode, ApiErrorDetail } from '@shared/api/errors';

const STATUS: Record<ApiErrorCode, number> = {
  validation_failed: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  csrf_invalid: 403,
  payload_too_large: 413,
  date_order_ambiguous: 422,
  rate_limited: 429,
  internal_error: 500,
  database_unavailable: 503,
  upstream_unavailable: 502,
};

/** The one error type the domain throws; the central handler turns it into the API's JSON error shape. */
export class AppError extends Error {
  readonly status: number;
  /** Sent as Retry-After (429, 503). */
  retryAfterSeconds?: number;

  constructor(
    readonly code: ApiErrorCode,
    message: string,
    readonly details?: ApiErrorDetail[],
  ) {
    super(message);
    this.name = 'AppError';
    this.status = STATUS[code];
  }

  static notFound(what: string): AppError {
    return new AppError('not_found', `${what} not found.`);
  }

  static forbidden(message = 'Your role does not allow this.'): AppError {
    return new AppError('forbidden', message);
  }

  static rateLimited(message: string, retryAfterSeconds: number): AppError {
    const err = new AppError('rate_limited', message);
    err.retryAfterSeconds = retryAfterSeconds;
    return err;
  }

  static invalid(field: string, message: string): AppError {
    return new AppError('validation_failed', `${field}: ${message}`, [{ field, message }]);
  }
}

/**
 * The error in words for people rather than API clients: a single field error without its field code
 * ("This site is not linked to a weather station…", not "weatherStation: This site…"), for exports and tables.
 */
export function plainReason(error: AppError): string {
  const only = error.details?.length === 1 ? error.details[0]!.message : null;
  if (!only) return error.message;
  return only.charAt(0).toUpperCase() + only.slice(1);
}
