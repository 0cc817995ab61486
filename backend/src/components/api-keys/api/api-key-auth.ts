import type { RequestHandler } from 'express';
import { AppError } from '../../../platform/app-error';
import type { ApiKeysService } from '../domain/api-keys-service';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** Set when the request carries an API key instead of a session. */
      apiKey?: { id: number; siteIds: number[] };
    }
  }
}

/** What a key may call: send a file to one of its sites, and follow that upload. */
const MACHINE_ROUTES: Array<[method: string, path: RegExp]> = [
  ['POST', /^\/sites\/\d+\/uploads\/?$/],
  ['POST', /^\/uploads\/?$/],
  ['GET', /^\/uploads\/\d+\/?$/],
];

/**
 * `Authorization: Bearer rk_…`: authenticates the key (401 when unknown or revoked) and stands in for the signed-in
 * user on the machine routes only. Requests without the header pass through to the session check.
 */
export function apiKeyAuth(keys: ApiKeysService): RequestHandler {
  return async (req, _res, next) => {
    const header = req.get('authorization');
    if (!header?.startsWith('Bearer ')) return next();
    const caller = await keys.authenticate(header.slice('Bearer '.length).trim());
    if (!caller) throw new AppError('unauthenticated', 'The API key is not valid or has been revoked.');
    if (!MACHINE_ROUTES.some(([method, path]) => req.method === method && path.test(req.path))) {
      throw AppError.forbidden(
        'An API key can only send uploads (POST /api/sites/:id/uploads, or POST /api/uploads for all its sites) ' +
          'and read their status (GET /api/uploads/:id).',
      );
    }
    req.user = caller.principal;
    req.apiKey = caller.apiKey;
    next();
  };
}
