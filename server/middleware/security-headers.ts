import { createHash } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import helmet from 'helmet';
import type { Env } from '../env';

/** SHA-256 sources for the inline scripts of the built page (the theme set before first paint). */
export function inlineScriptHashes(clientDir: string): string[] {
  const index = join(clientDir, 'index.html');
  if (!existsSync(index)) return [];
  const html = readFileSync(index, 'utf8');
  const hashes: string[] = [];
  for (const m of html.matchAll(/<script(?![^>]*\bsrc=)[^>]*>([\s\S]*?)<\/script>/gi)) {
    hashes.push(`'sha256-${createHash('sha256').update(m[1], 'utf8').digest('base64')}'`);
  }
  return hashes;
}

/**
 * helmet's headers with a Content-Security-Policy that allows only what the client loads: its
 * own scripts, styles, fonts and images; blob: for the audio engine's worklets and workers and
 * for files made in the page; data: for fonts and images inlined by the build. No framing
 * (frame-ancestors 'none'), no plugins, forms post only here. HSTS in production only (a
 * browser ignores it over plain HTTP, and a local trial has no certificate).
 */
export function securityHeaders(env: Env, clientDir: string) {
  const production = env.NODE_ENV === 'production';
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        'default-src': ["'self'"],
        'script-src': ["'self'", 'blob:', ...inlineScriptHashes(clientDir)],
        // React and the charts set style attributes; the notation library writes <style> too.
        'style-src': ["'self'", "'unsafe-inline'"],
        'font-src': ["'self'", 'data:'],
        'img-src': ["'self'", 'data:', 'blob:'],
        'media-src': ["'self'", 'blob:', 'data:'],
        'connect-src': ["'self'", 'blob:', 'data:'],
        'worker-src': ["'self'", 'blob:'],
        'object-src': ["'none'"],
        'base-uri': ["'self'"],
        'form-action': ["'self'"],
        'frame-ancestors': ["'none'"],
        'frame-src': ["'none'"],
      },
    },
    // The checkout page lives on the payment service's own origin; going there is a navigation.
    crossOriginEmbedderPolicy: false,
    strictTransportSecurity: production ? { maxAge: 31_536_000, includeSubDomains: true } : false,
    referrerPolicy: { policy: 'strict-origin-when-cross-origin' },
    frameguard: { action: 'deny' },
  });
}
