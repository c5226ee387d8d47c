import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { AppError } from '../errors';

/**
 * Paths that prove themselves another way: webhooks from hosted services carry a signature
 * and never have a browser session. Paths are as seen under /api.
 */
export const CSRF_EXEMPT = new Set<string>(['/payments/webhook']);

const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** The session's CSRF token, made on first use. */
export function csrfTokenFor(req: Request): string {
  req.session.csrfToken ??= randomBytes(32).toString('base64url');
  return req.session.csrfToken;
}

function same(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

/** Every state-changing request under /api must echo the session's token in X-CSRF-Token. */
export const requireCsrf: RequestHandler = (req, _res, next) => {
  if (!UNSAFE.has(req.method) || CSRF_EXEMPT.has(req.path)) return next();
  const expected = req.session?.csrfToken;
  const sent = req.get('x-csrf-token');
  if (!expected || !sent || !same(expected, sent)) {
    return next(new AppError('csrf', 'This form has gone stale; reload the page and try again'));
  }
  next();
};
