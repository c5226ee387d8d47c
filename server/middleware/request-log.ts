import type { IncomingMessage, ServerResponse } from 'node:http';
import type { RequestHandler } from 'express';
import pino, { type DestinationStream } from 'pino';
import { pinoHttp } from 'pino-http';
import type { Env } from '../env';

/**
 * The path only, with secrets taken out: no query string (reset tokens, filters), and the
 * invite token in /api/invites/<token> replaced by a placeholder.
 */
export function loggedPath(url: string | undefined): string {
  const path = (url ?? '').split('?')[0];
  return path.replace(/^\/api\/invites\/[^/]+/, '/api/invites/:token');
}

/**
 * One JSON line per request (pino-http): method, path, status, time taken and an id. No
 * headers are logged (so no cookies, CSRF tokens or signatures), no bodies (so no passwords),
 * no query strings.
 */
export function requestLogger(env: Env, stream?: DestinationStream) {
  const logger = pino({ level: env.LOG_LEVEL, base: undefined }, stream);
  return pinoHttp({
    logger,
    quietReqLogger: true,
    serializers: {
      req: (req: IncomingMessage & { id?: unknown }) => ({ id: req.id, method: req.method, path: loggedPath(req.url) }),
      res: (res: ServerResponse) => ({ status: res.statusCode }),
      err: (err: Error & { code?: unknown }) => ({
        type: err.name,
        code: typeof err.code === 'string' ? err.code : undefined,
        // A failed query's message lists its parameters (e-mails, hashes): keep the first line.
        message: String(err.message ?? '').split('\n')[0],
      }),
    },
    customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : 'info'),
  });
}

let warned = false;

/**
 * Behind a proxy without TRUST_PROXY every visitor seems to come from the proxy's address, so
 * the per-source limits would count them all as one: say so once, in the log.
 */
export const warnOfUntrustedProxy: RequestHandler = (req, _res, next) => {
  if (!warned && req.headers['x-forwarded-for']) {
    warned = true;
    console.warn(
      '[sixfold] requests carry X-Forwarded-For but TRUST_PROXY is not 1: behind a proxy, set TRUST_PROXY=1 so sign-in and other limits count each visitor, not the proxy',
    );
  }
  next();
};
