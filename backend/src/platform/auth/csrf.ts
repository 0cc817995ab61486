import { doubleCsrf } from 'csrf-csrf';
import type { ErrorRequestHandler, Request, Response } from 'express';
import type { Config } from '../../config';
import { AppError } from '../app-error';

/** Cookie and header names Angular's HttpClient uses for XSRF out of the box. */
export const CSRF_COOKIE = 'XSRF-TOKEN';
export const CSRF_HEADER = 'x-xsrf-token';

/**
 * Signed double-submit CSRF protection (csrf-csrf): the token is an HMAC over the session id, sent back
 * by the browser both as a cookie and as the X-XSRF-TOKEN header on every state-changing request.
 * Only a request that a valid API key has already authenticated (`req.apiKey`, set by apiKeyAuth, which runs
 * first) skips the check: it is authorised by the key, not by cookies a browser could be tricked into sending.
 * A mere `Authorization: Bearer …` header proves nothing and skips nothing.
 */
export function createCsrf(config: Config) {
  const { doubleCsrfProtection, generateCsrfToken } = doubleCsrf({
    getSecret: () => config.session.secret,
    getSessionIdentifier: (req) => req.sessionID ?? '',
    cookieName: CSRF_COOKIE,
    cookieOptions: { httpOnly: false, sameSite: 'strict', secure: config.session.secureCookies, path: '/' },
    getCsrfTokenFromRequest: (req) => req.get(CSRF_HEADER),
    skipCsrfProtection: (req) => req.apiKey !== undefined,
  });

  /** Issues a token bound to this session; marks the session so it is saved and its id stays stable. */
  const issue = (req: Request, res: Response): string => {
    req.session.csrfIssued = true;
    return generateCsrfToken(req, res, { overwrite: true });
  };

  const toAppError: ErrorRequestHandler = (err, _req, _res, next) => {
    if ((err as { code?: string }).code === 'EBADCSRFTOKEN') {
      next(
        new AppError('csrf_invalid', 'The security token is missing or out of date. Reload the page and try again.'),
      );
    } else {
      next(err);
    }
  };

  return { protect: doubleCsrfProtection, issue, toAppError };
}
