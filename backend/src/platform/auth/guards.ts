import type { Request, RequestHandler } from 'express';
import { capabilities, type Capabilities } from '@shared/auth/roles';
import { AppError } from '../app-error';
import type { Principal } from './principal';

/** 401 unless signed in. */
export const requireSignedIn: RequestHandler = (req, _res, next) => {
  if (!req.user) throw new AppError('unauthenticated', 'Sign in to continue.');
  next();
};

/** 403 unless the user's role in the active organisation has the capability. */
export function requireCapability(capability: keyof Capabilities): RequestHandler {
  return (req, _res, next) => {
    const user = principalOf(req);
    if (!capabilities(user.role)[capability]) throw AppError.forbidden();
    next();
  };
}

export function principalOf(req: Request): Principal {
  if (!req.user) throw new AppError('unauthenticated', 'Sign in to continue.');
  return req.user;
}
