import type { Request } from 'express';
import type { Env } from '../env';

/** Where e-mailed links point: PUBLIC_URL, or outside production the address the request came to. */
export function linkOrigin(req: Request, env: Env): string | null {
  if (env.PUBLIC_URL) return env.PUBLIC_URL.replace(/\/+$/, '');
  // A Host header is the sender's to choose; in production only PUBLIC_URL is trusted.
  if (env.NODE_ENV === 'production') return null;
  return `${req.protocol}://${req.get('host')}`;
}
