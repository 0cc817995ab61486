import { HttpErrorResponse } from '@angular/common/http';
import type { AbstractControl, FormGroup } from '@angular/forms';
import type { ApiErrorBody, ApiErrorCode } from '@shared/api/errors';

/** An API failure as the UI shows it: one sentence plus messages per form field. */
export interface ApiProblem {
  status: number;
  code: ApiErrorCode | null;
  message: string;
  /** Keyed by the top-level field name (`tags.2` becomes `tags`). */
  fields: Record<string, string>;
}

function isApiErrorBody(body: unknown): body is ApiErrorBody {
  return typeof body === 'object' && body !== null && typeof (body as ApiErrorBody).error?.message === 'string';
}

export function describeApiError(err: unknown, fallback = 'Something went wrong. Please try again.'): ApiProblem {
  if (!(err instanceof HttpErrorResponse)) {
    return { status: 0, code: null, message: fallback, fields: {} };
  }
  if (isApiErrorBody(err.error)) {
    const fields: Record<string, string> = {};
    for (const detail of err.error.error.details ?? []) {
      const field = detail.field.split('.')[0];
      fields[field] ??= detail.message;
    }
    return { status: err.status, code: err.error.error.code, message: err.error.error.message, fields };
  }
  return { status: err.status, code: null, message: messageForStatus(err.status, fallback), fields: {} };
}

function messageForStatus(status: number, fallback: string): string {
  if (status === 0) return 'The Rillmark server cannot be reached. Check your connection and try again.';
  if (status === 401) return 'Your session has ended. Please sign in again.';
  if (status === 403) return 'You are not allowed to do this.';
  if (status === 404) return 'This item does not exist or is not visible to you.';
  if (status === 429) return 'Too many attempts. Please wait a moment and try again.';
  if (status >= 500) return 'The server ran into a problem. Please try again in a moment.';
  return fallback;
}

/**
 * Puts server-side field messages onto the matching controls as a `server` error; returns the fields that
 * had no control, so the caller can show them with the general message.
 */
export function applyFieldErrors(form: FormGroup, fields: Record<string, string>): string[] {
  const unmatched: string[] = [];
  for (const [field, message] of Object.entries(fields)) {
    const control: AbstractControl | null = form.get(field);
    if (control) {
      control.setErrors({ ...control.errors, server: message });
      control.markAsTouched();
    } else {
      unmatched.push(`${field}: ${message}`);
    }
  }
  return unmatched;
}
