import type { RequestHandler } from 'express';
import type { Access } from './routes.js';
import type { User } from '../entities/User.js';
import { ForbiddenError, UnauthorisedError } from './errors.js';

/** The role guard every route passes through; `access` is stated by the route itself. */
export function requireAccess(access: Access): RequestHandler {
  return (req, _res, next) => {
    if (access === 'public') return next();
    const user = req.user as User | undefined;
    if (!user) return next(new UnauthorisedError());
    if (access === 'signed-in' || access.includes(user.role)) return next();
    next(new ForbiddenError(`this needs the ${access.join(' or ')} role; you are signed in as ${user.role}`));
  };
}

/** Shorthand used by routes: `requireRole('admin')`. */
export const requireRole = (...roles: User['role'][]): RequestHandler => requireAccess(roles);
