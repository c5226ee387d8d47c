import connectPgSimple from 'connect-pg-simple';
import type { Request } from 'express';
import session from 'express-session';
import type pg from 'pg';
import type { Env } from '../env';

declare module 'express-session' {
  interface SessionData {
    userId?: string;
    csrfToken?: string;
  }
}

export const SESSION_COOKIE = 'sixfold.sid';

/** Sessions in PostgreSQL (connect-pg-simple); the cookie is HttpOnly, SameSite=Lax, Secure over HTTPS. */
export function sessionMiddleware(env: Env, pool: pg.Pool) {
  const PgStore = connectPgSimple(session);
  return session({
    store: new PgStore({ pool, tableName: 'session', createTableIfMissing: false }),
    name: SESSION_COOKIE,
    secret: env.SESSION_SECRET,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      // Secure whenever the request came over HTTPS (directly or through a trusted proxy).
      secure: 'auto',
      maxAge: 1000 * 60 * 60 * 24 * 14,
    },
  });
}

/** A new session id for a new sign-in (no session fixation); the old session is gone. */
export function regenerateSession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
}

export function saveSession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}

export function destroySession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
}
