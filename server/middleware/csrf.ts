import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import type { Env } from '../env';
import { AppError } from '../errors';
import { cookieSecure } from './session';

/**
 * Paths that prove themselves another way: webhooks from hosted services carry a signature
 * and never have a browser session. Paths are as seen under /api.
 */
export const CSRF_EXEMPT = new Set<string>(['/payments/webhook']);

/** A signed-out visitor's token lives in this cookie, not in a session row. */
export const ANON_CSRF_COOKIE = 'sixfold.csrf';

const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** The session's CSRF token, made on first use (signed-in sessions only: they have a row anyway). */
export function csrfTokenFor(req: Request): string {
  req.session.csrfToken ??= randomBytes(32).toString('base64url');
  return req.session.csrfToken;
}

function same(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

const mac = (secret: string, nonce: string) => createHmac('sha256', secret).update(`csrf:${nonce}`).digest('base64url');

/** A signed double-submit token: a random nonce and its HMAC under the session secret. */
function newAnonToken(secret: string): string {
  const nonce = randomBytes(24).toString('base64url');
  return `${nonce}.${mac(secret, nonce)}`;
}

function validAnonToken(secret: string, token: string | undefined): token is string {
  if (!token || token.length > 200) return false;
  const [nonce, sig, extra] = token.split('.');
  return Boolean(nonce && sig && extra === undefined && same(sig, mac(secret, nonce)));
}

function readCookie(req: Request, name: string): string | undefined {
  const header = req.headers.cookie;
  if (!header) return undefined;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) {
      try {
        return decodeURIComponent(part.slice(eq + 1).trim());
      } catch {
        return undefined;
      }
    }
  }
  return undefined;
}

/**
 * The token for GET /api/auth/csrf. A signed-in session keeps its token in its row; a
 * signed-out visitor gets a signed token in a cookie of its own, so fetching one writes
 * nothing to the database (a flood of anonymous fetches makes no session rows).
 */
export function issueCsrfToken(req: Request, res: Response, env: Env): string {
  if (req.session?.csrfToken) return req.session.csrfToken;
  const existing = readCookie(req, ANON_CSRF_COOKIE);
  if (validAnonToken(env.SESSION_SECRET, existing)) return existing;
  const token = newAnonToken(env.SESSION_SECRET);
  res.cookie(ANON_CSRF_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    path: '/api',
    secure: cookieSecure(env, req),
  });
  return token;
}

/**
 * Every state-changing request under /api must echo its token in X-CSRF-Token: the session's
 * when it has one, else the signed-out cookie's (which another site can neither read nor set).
 */
export function requireCsrf(env: Env): RequestHandler {
  return (req, _res, next) => {
    if (!UNSAFE.has(req.method) || CSRF_EXEMPT.has(req.path)) return next();
    const sent = req.get('x-csrf-token');
    const expected = req.session?.csrfToken;
    const ok = expected
      ? Boolean(sent && same(expected, sent))
      : Boolean(
          sent && validAnonToken(env.SESSION_SECRET, sent) && same(sent, readCookie(req, ANON_CSRF_COOKIE) ?? ''),
        );
    if (!ok) return next(new AppError('csrf', 'This form has gone stale; reload the page and try again'));
    next();
  };
}
