import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../helpers/test-server';

// A client build of this file's own: one page with an inline script, as index.html has.
const dir = mkdtempSync(join(tmpdir(), 'sixfold-client-'));
const inline = "document.documentElement.classList.add('dark');";
writeFileSync(
  join(dir, 'index.html'),
  `<!doctype html><html><head><script>${inline}</script><script type="module" src="/assets/a.js"></script></head><body></body></html>`,
);
const before = process.env.CLIENT_DIR;
process.env.CLIENT_DIR = dir;
const ctx = createTestApp();
beforeAll(() => {
  if (before === undefined) delete process.env.CLIENT_DIR;
  else process.env.CLIENT_DIR = before;
});
afterAll(async () => {
  await ctx.close();
  rmSync(dir, { recursive: true, force: true });
});

const csp = (header: string) =>
  Object.fromEntries(
    header.split(';').map((d) => {
      const [name, ...values] = d.trim().split(/\s+/);
      return [name, values];
    }),
  );

describe('security headers', () => {
  it('the page and the API carry a CSP that allows only what the client loads, and no framing', async () => {
    for (const path of ['/', '/api/health']) {
      const res = await request(ctx.app).get(path);
      const policy = csp(res.headers['content-security-policy']);
      expect(policy['default-src']).toEqual(["'self'"]);
      expect(policy['frame-ancestors']).toEqual(["'none'"]);
      expect(policy['object-src']).toEqual(["'none'"]);
      // The inline theme script is allowed by its hash (CSP Level 3: sha256 of the script text), nothing else inline.
      const hash = `'sha256-${createHash('sha256').update(inline).digest('base64')}'`;
      expect(policy['script-src']).toContain(hash);
      expect(policy['script-src']).not.toContain("'unsafe-inline'");
      expect(policy['script-src']).not.toContain("'unsafe-eval'");
      expect(policy['connect-src']).toContain("'self'");
      expect(res.headers['x-frame-options']).toBe('DENY');
      expect(res.headers['x-content-type-options']).toBe('nosniff');
      expect(res.headers['referrer-policy']).toBe('strict-origin-when-cross-origin');
      expect(res.headers['x-powered-by']).toBeUndefined();
      // Not over plain HTTP outside production (a browser ignores it there anyway).
      expect(res.headers['strict-transport-security']).toBeUndefined();
    }
  });
});
