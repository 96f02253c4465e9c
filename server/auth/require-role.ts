import type { Request, RequestHandler } from 'express';
import type { Role } from '../../shared/roles';
import type { SessionUser } from '../../shared/auth';
import { scopeOf, type Scope } from '../db/scope';
import { ForbiddenError, UnauthorizedError } from '../errors';

/** 401 when signed out, 403 when the role is not one of `roles`. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) throw new UnauthorizedError();
    if (!roles.includes(req.user.role)) throw new ForbiddenError(`This needs one of the roles: ${roles.join(', ')}`);
    next();
  };
}

/** The signed-in user (after requireRole). */
export function currentUser(req: Request): SessionUser {
  if (!req.user) throw new UnauthorizedError();
  return req.user;
}

/** The caller's data scope (after requireRole). */
export function scopeFromRequest(req: Request): Scope {
  return scopeOf(currentUser(req));
}
