import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { Config } from '../../config';
import type { createCsrf } from '../../platform/auth/csrf';
import { createPassport } from '../../platform/auth/passport';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { UsersRepository } from '../users/data/users-repository';
import { authRouter } from './api/auth-router';
import { SignInFailuresRepository } from './data/sign-in-failures-repository';
import { AuthService } from './domain/auth-service';
import { SignInThrottle } from './domain/sign-in-throttle';

export interface Auth {
  service: AuthService;
  /** This app's own Passport (sessions carry ids; the principal is reloaded per request). */
  passport: ReturnType<typeof createPassport>;
  /** /auth */
  router: Router;
  /** Stops the timer that prunes old sign-in failure counts. */
  close(): void;
}

/** Wires sign-in (with its limits), sign-out and one-time links. */
export function createAuth(deps: {
  db: DataSource;
  users: UsersRepository;
  audit: AuditRepository;
  csrf: ReturnType<typeof createCsrf>;
  config: Config;
}): Auth {
  const service = new AuthService(deps.db, deps.users, deps.audit);
  const passport = createPassport(service);
  const failures = new SignInFailuresRepository(deps.db);
  const throttle = new SignInThrottle(failures, deps.config.signIn);
  // Expired sign-in counts are dropped now and then so the table stays small.
  const pruneTimer = setInterval(() => void failures.prune(new Date()).catch(() => undefined), 15 * 60_000);
  pruneTimer.unref();
  const router = Router().use(
    '/auth',
    authRouter({ auth: service, passport, csrf: deps.csrf, throttle, config: deps.config }),
  );
  return { service, passport, router, close: () => clearInterval(pruneTimer) };
}
