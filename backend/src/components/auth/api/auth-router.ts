import { Router, type Request, type RequestHandler, type Response } from 'express';
import type { createPassport } from '../../../platform/auth/passport';
import { z } from 'zod';
import { PASSWORD_MIN_LENGTH } from '@shared/users/user';
import type { Config } from '../../../config';
import { AppError } from '../../../platform/app-error';
import { principalOf, requireSignedIn } from '../../../platform/auth/guards';
import type { Principal } from '../../../platform/auth/principal';
import { validate } from '../../../platform/validation';
import type { AuthService } from '../domain/auth-service';
import type { SignInThrottle } from '../domain/sign-in-throttle';

const signInBody = z.strictObject({
  email: z.string().trim().toLowerCase().email('must be an e-mail address').max(254),
  password: z.string().min(1, 'is required').max(200),
});
const tokenPasswordBody = z.strictObject({
  token: z.string().min(10).max(200),
  password: z.string().min(PASSWORD_MIN_LENGTH, `must be at least ${PASSWORD_MIN_LENGTH} characters`).max(200),
});
const switchBody = z.strictObject({ organisationId: z.number().int().positive() });

interface Deps {
  auth: AuthService;
  passport: ReturnType<typeof createPassport>;
  csrf: { issue: (req: Request, res: Response) => string };
  throttle: SignInThrottle;
  config: Config;
}

/** Sign-in and account links are for people: a request carrying an API key is refused before anything else. */
const noApiKeys: RequestHandler = (req, _res, next) => {
  if (req.get('authorization') !== undefined)
    throw AppError.forbidden('The sign-in routes do not take an Authorization header; API keys only send uploads.');
  next();
};

/** /api/auth: CSRF token, sign-in and out, the current user, and one-time links. */
export function authRouter({ auth, passport, csrf, throttle }: Deps): Router {
  const router = Router();
  router.use(noApiKeys);

  router.get('/csrf', (req, res) => {
    res.json({ token: csrf.issue(req, res) });
  });

  router.post('/sign-in', async (req, res) => {
    req.body = validate(signInBody, req.body, 'Sign-in');
    // Only wrong passwords count; see SignInThrottle for the per-address and per-account limits.
    const principal = await throttle.attempt(
      { email: req.body.email, address: req.ip ?? '' },
      () =>
        new Promise<Principal | null>((resolve, reject) => {
          passport.authenticate('local', { session: false }, (err: unknown, user: Principal | false) =>
            err ? reject(err) : resolve(user || null),
          )(req, res, () => undefined);
        }),
    );
    if (!principal) throw new AppError('unauthenticated', 'That e-mail and password do not match an active account.');
    await logIn(req, principal);
    csrf.issue(req, res);
    res.json(auth.currentUser(principal));
  });

  router.post('/sign-out', async (req, res) => {
    await new Promise<void>((resolve, reject) =>
      req.logout({ keepSessionInfo: false }, (err) => (err ? reject(err) : resolve())),
    );
    csrf.issue(req, res);
    res.status(204).end();
  });

  router.get('/me', requireSignedIn, (req, res) => {
    csrf.issue(req, res);
    res.json(auth.currentUser(principalOf(req)));
  });

  router.post('/organisation', requireSignedIn, async (req, res) => {
    const { organisationId } = validate(switchBody, req.body);
    const current = principalOf(req);
    if (!current.memberships.some((m) => m.organisationId === organisationId)) throw AppError.notFound('Organisation');
    const principal = (await auth.principal(current.userId, organisationId))!;
    await logIn(req, principal);
    csrf.issue(req, res);
    res.json(auth.currentUser(principal));
  });

  router.get('/tokens/:token', async (req, res) => {
    res.json(await auth.tokenInfo(String(req.params['token'])));
  });

  router.post('/accept-invite', async (req, res) => {
    const body = validate(tokenPasswordBody, req.body);
    const userId = await auth.completeToken(body.token, body.password, 'invite');
    const principal = (await auth.principal(userId))!;
    await logIn(req, principal);
    csrf.issue(req, res);
    res.json(auth.currentUser(principal));
  });

  router.post('/reset-password', async (req, res) => {
    const body = validate(tokenPasswordBody, req.body);
    await auth.completeToken(body.token, body.password, 'reset');
    res.status(204).end();
  });

  return router;
}

/** passport's logIn regenerates the session id (no fixation) and stores the ids. */
function logIn(req: Request, principal: Principal): Promise<void> {
  return new Promise((resolve, reject) => req.logIn(principal, (err) => (err ? reject(err) : resolve())));
}
