/** The one JSON error shape every API route returns. */
export interface ApiErrorBody {
  error: {
    /** Stable machine-readable code, e.g. `validation_failed`, `not_found`. */
    code: ApiErrorCode;
    /** A sentence a person can read. */
    message: string;
    /** Per-field problems (validation), or per-row problems (uploads). */
    details?: ApiErrorDetail[];
  };
}

export interface ApiErrorDetail {
  /** Dotted path of the field, e.g. `timeZone` or `tags.2`. */
  field: string;
  message: string;
}

export type ApiErrorCode =
  | 'validation_failed'
  | 'unauthenticated'
  | 'forbidden'
  | 'not_found'
  | 'conflict'
  | 'csrf_invalid'
  | 'rate_limited'
  | 'payload_too_large'
  | 'database_unavailable'
  /**
   * An upload whose numeric dates fit both day-first and month-first (or disagree): send it again with
   * `dateOrder` (`day-first` or `month-first`); nothing was stored.
   */
  | 'date_order_ambiguous'
  /** A service Rillmark calls (e.g. the weather feed) did not answer or answered nonsense. */
  | 'upstream_unavailable'
  | 'internal_error';
