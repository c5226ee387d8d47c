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

/**
 * Whether cookies carry Secure: always in production (COOKIE_SECURE=1, the default there; behind
 * a TLS-ending proxy set TRUST_PROXY=1 so X-Forwarded-Proto is believed), never with 0 (a
 * plain-HTTP trial), and otherwise whenever the request itself came over HTTPS.
 */
export function cookieSecure(env: Env, req?: Request): boolean {
  if (env.COOKIE_SECURE === '1') return true;
  if (env.COOKIE_SECURE === '0') return false;
  return Boolean(req?.secure);
}

/** How often a session's expiry is moved on in the store while it is in use. */
export const SESSION_TOUCH_EVERY_MS = 60_000;

/**
 * The store, moving a session's stored expiry on at most once a minute: every request answers
 * with a fresh cookie (rolling), but writing the row on each one was a commit per request. The
 * stored expiry lags the cookie's by under a minute of a 14-day life.
 */
function throttleTouch<S extends session.Store>(store: S): S {
  const touchedAt = new Map<string, number>();
  if (!store.touch) return store;
  const touch = store.touch.bind(store);
  store.touch = (sid, sess, done) => {
    const now = Date.now();
    const last = touchedAt.get(sid);
    if (last !== undefined && now - last < SESSION_TOUCH_EVERY_MS) {
      done?.();
      return;
    }
    if (touchedAt.size > 100_000) {
      for (const [id, at] of touchedAt) if (now - at >= SESSION_TOUCH_EVERY_MS) touchedAt.delete(id);
    }
    touchedAt.set(sid, now);
    touch(sid, sess, done);
  };
  return store;
}

/** Sessions in PostgreSQL (connect-pg-simple); the cookie is HttpOnly, SameSite=Lax, Secure as above. */
export function sessionMiddleware(env: Env, pool: pg.Pool) {
  const PgStore = connectPgSimple(session);
  return session({
    store: throttleTouch(new PgStore({ pool, tableName: 'session', createTableIfMissing: false })),
    name: SESSION_COOKIE,
    secret: env.SESSION_SECRET,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    // With TRUST_PROXY the proxy's X-Forwarded-Proto says whether the visitor used HTTPS.
    ...(env.TRUST_PROXY === '1' ? { proxy: true } : {}),
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: env.COOKIE_SECURE === '1' ? true : env.COOKIE_SECURE === '0' ? false : 'auto',
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
