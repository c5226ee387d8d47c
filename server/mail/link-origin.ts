import type { Request } from 'express';
import type { Env } from '../env';

/**
 * Where e-mailed links (and checkout's way back) point: PUBLIC_URL, or outside production this
 * server's own HOST and the port it listens on. Never a request header: Host and the
 * X-Forwarded-* headers are the sender's to choose, and a forged one would send a reset link
 * to someone else's site.
 */
export function linkOrigin(req: Request | null, env: Env): string | null {
  if (env.PUBLIC_URL) return env.PUBLIC_URL.replace(/\/+$/, '');
  if (env.NODE_ENV === 'production') return null;
  return localOrigin(env, req?.socket.localPort);
}

/** http://HOST:PORT of this server, with a wildcard HOST read as loopback. */
export function localOrigin(env: Env, port: number = env.PORT): string {
  const host = env.HOST === '0.0.0.0' || env.HOST === '::' ? '127.0.0.1' : env.HOST;
  return `http://${host.includes(':') ? `[${host}]` : host}:${port}`;
}
