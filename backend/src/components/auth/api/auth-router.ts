import { Router, type Request, type Response } from 'express';
import { ipKeyGenerator, rateLimit, type Store } from 'express-rate-limit';
import type { createPassport } from '../../../platform/auth/passport';
import { z } from 'zod';
import { PASSWORD_MIN_LENGTH } from '@shared/users/user';
import type { Config } from '../../../config';
import { AppError } from '../../../platform/app-error';
import { principalOf, requireSignedIn } from '../../../platform/auth/guards';
import type { Principal } from '../../../platform/auth/principal';
import { validate } from '../../../platform/validation';
import type { AuthService } from '../domain/auth-service';

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
  rateLimitStore: Store;
  config: Config;
}

/** /api/auth: CSRF token, sign-in and out, the current user, and one-time links. */
export function authRouter({ auth, passport, csrf, rateLimitStore, config }: Deps): Router {
  const router = Router();

  // Counted per client address and e-mail; successful sign-ins don't count.
  const signInLimiter = rateLimit({
    windowMs: config.signIn.windowMs,
    limit: config.signIn.maxAttempts,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: true,
    store: rateLimitStore,
    keyGenerator: (req) =>
      `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '')
        .trim()
        .toLowerCase()}`,
    handler: (_req, _res, next, options) => {
      const minutes = Math.ceil(options.windowMs / 60_000);
      next(
        new AppError(
          'rate_limited',
          `Too many sign-in attempts. Wait ${minutes} minutes and try again, ` +
            'or ask your administrator to reset your password.',
        ),
      );
    },
  });

  router.get('/csrf', (req, res) => {
    res.json({ token: csrf.issue(req, res) });
  });

  router.post('/sign-in', signInLimiter, async (req, res) => {
    req.body = validate(signInBody, req.body, 'Sign-in');
    const principal = await new Promise<Principal | false>((resolve, reject) => {
      passport.authenticate('local', { session: false }, (err: unknown, user: Principal | false) =>
        err ? reject(err) : resolve(user),
      )(req, res, () => undefined);
    });
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
