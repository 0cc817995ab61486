import {
  HttpClient,
  HttpErrorResponse,
  HttpInterceptorFn,
  HttpRequest,
  HttpXsrfTokenExtractor,
} from '@angular/common/http';
import { inject } from '@angular/core';
import { catchError, map, Observable, switchMap, throwError } from 'rxjs';
import type { ApiErrorBody } from '@shared/api/errors';

const HEADER = 'X-XSRF-TOKEN';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Makes sure state-changing API calls carry a CSRF token. Angular's own XSRF interceptor runs first and
 * only copies an existing cookie, so this one fetches `/api/auth/csrf` when there is none yet, and fetches a
 * fresh token once when the server rejects it (the token is tied to the session, which sign-in renews).
 */
export const csrfInterceptor: HttpInterceptorFn = (req, next) => {
  if (SAFE_METHODS.has(req.method) || !req.url.startsWith('/api/')) return next(req);

  const http = inject(HttpClient);
  const cookie = inject(HttpXsrfTokenExtractor);
  const freshToken = (): Observable<string> =>
    http.get<{ token: string }>('/api/auth/csrf').pipe(map((body) => cookie.getToken() ?? body.token));
  const withToken = (request: HttpRequest<unknown>, token: string) =>
    request.clone({ setHeaders: { [HEADER]: token } });

  const existing = cookie.getToken();
  const first = existing
    ? next(withToken(req, existing))
    : freshToken().pipe(switchMap((t) => next(withToken(req, t))));

  return first.pipe(
    catchError((err: unknown) => {
      const body = err instanceof HttpErrorResponse ? (err.error as ApiErrorBody | null) : null;
      if (body?.error?.code !== 'csrf_invalid') return throwError(() => err);
      return freshToken().pipe(switchMap((t) => next(withToken(req, t))));
    }),
  );
};
