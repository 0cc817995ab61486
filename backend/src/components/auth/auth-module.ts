import { Router } from 'express';
import type { Store } from 'express-rate-limit';
import type { DataSource } from 'typeorm';
import type { Config } from '../../config';
import type { createCsrf } from '../../platform/auth/csrf';
import { createPassport } from '../../platform/auth/passport';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { UsersRepository } from '../users/data/users-repository';
import { authRouter } from './api/auth-router';
import { AuthService } from './domain/auth-service';

export interface Auth {
  service: AuthService;
  /** This app's own Passport (sessions carry ids; the principal is reloaded per request). */
  passport: ReturnType<typeof createPassport>;
  /** /auth */
  router: Router;
}

/** Wires sign-in, sign-out and one-time links. */
export function createAuth(deps: {
  db: DataSource;
  users: UsersRepository;
  audit: AuditRepository;
  csrf: ReturnType<typeof createCsrf>;
  rateLimitStore: Store;
  config: Config;
}): Auth {
  const service = new AuthService(deps.db, deps.users, deps.audit);
  const passport = createPassport(service);
  const router = Router().use(
    '/auth',
    authRouter({ auth: service, passport, csrf: deps.csrf, rateLimitStore: deps.rateLimitStore, config: deps.config }),
  );
  return { service, passport, router };
}
