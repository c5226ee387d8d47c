import type { Request, RequestHandler } from 'express';
import type { Role, User } from '../../shared/schemas/auth';
import type { Db } from '../db/client';
import { forbidden, unauthenticated } from '../errors';
import { getSessionUser } from '../services/auth/get-session-user';

declare module 'express-serve-static-core' {
  interface Request {
    /** the signed-in user, set by loadUser when the session has one that still works */
    user?: User;
  }
}

/**
 * Looks up the session's user on every API request (a primary-key read), so an account that
 * was switched off or removed stops working at once: the session forgets it.
 */
export function loadUser(db: Db): RequestHandler {
  return async (req, _res, next) => {
    const id = req.session?.userId;
    if (!id) return next();
    const user = await getSessionUser(db, id);
    if (user) {
      req.user = user;
      return next();
    }
    delete req.session.userId;
    next();
  };
}

/** Signed out -> 401. */
export const signedIn: RequestHandler = (req, _res, next) => {
  next(req.user ? undefined : unauthenticated());
};

/**
 * The signed-in user of a request behind `signedIn` or `requireRole`; a 401 if there is none
 * (so a route mounted without its guard fails closed, never with a TypeError).
 */
export function requireUser(req: Request): User {
  if (!req.user) throw unauthenticated();
  return req.user;
}

/** Signed out -> 401; a role that may never use the route -> 403. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(unauthenticated());
    if (!roles.includes(req.user.role))
      return next(forbidden(`This is for ${roles.map((r) => `${r}s`).join(' and ')} only`));
    next();
  };
}
