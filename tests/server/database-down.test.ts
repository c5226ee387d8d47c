import { createHmac } from 'node:crypto';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { createDb } from '../../server/db/client';
import { parseEnv } from '../../server/env';
import { listRoutes } from '../helpers/routes';

// A port nothing listens on: every connection the pool tries is refused.
const url = 'postgres://sixfold@127.0.0.1:1/none';
const env = parseEnv({ NODE_ENV: 'test', DATABASE_URL: url });
const { db, pool } = createDb(url, 2);
const app = createApp({ db, pool, env });
afterAll(() => pool.end());

/** A session cookie signed as express-session signs it (cookie-signature: HMAC-SHA256, base64, no padding). */
function sessionCookie(sid: string): string {
  const mac = createHmac('sha256', env.SESSION_SECRET).update(sid).digest('base64').replace(/=+$/, '');
  return `sixfold.sid=${encodeURIComponent(`s:${sid}.${mac}`)}`;
}

function expectBusy(res: request.Response, what: string) {
  if (res.status !== 503) throw new Error(`${what} answered ${res.status}: ${JSON.stringify(res.body)}`);
  expect(res.headers['retry-after']).toMatch(/^\d+$/);
  expect(res.body.error.code).toBe('unavailable');
  expect(res.body.error.message).toMatch(/busy/);
}

describe('with the database unreachable', () => {
  it('every API route answers 503 with Retry-After and a plain message (signed in)', async () => {
    const cookie = sessionCookie('a-session-the-store-cannot-read');
    const routes = listRoutes(app).filter((r) => r.path.startsWith('/api') && r.path !== '/api/payments/webhook');
    expect(routes.length).toBeGreaterThan(50);
    for (const r of routes) {
      const path = r.path.replace(/:[A-Za-z]+/g, '00000000-0000-4000-8000-000000000000');
      const res = await request(app)
        [r.method.toLowerCase() as 'get'](path)
        .set('Cookie', cookie)
        .set('X-CSRF-Token', 'x');
      if (r.path === '/api/health') {
        expect(res.status).toBe(503);
        continue;
      }
      expectBusy(res, `${r.method} ${path}`);
    }
  });

  it('signed out: the catalogue, sign-in and a take answer 503, not 500', async () => {
    const agent = request.agent(app);
    // The signed-out CSRF token needs no database.
    const { token } = (await agent.get('/api/auth/csrf').expect(200)).body;
    expectBusy(await agent.get('/api/books'), 'GET /api/books');
    expectBusy(
      await agent
        .post('/api/auth/sign-in')
        .set('X-CSRF-Token', token)
        .send({ email: 'a@b.example', password: 'long-password' }),
      'sign-in',
    );
    expectBusy(
      await agent.post('/api/auth/password-reset').set('X-CSRF-Token', token).send({ email: 'a@b.example' }),
      'password reset',
    );
  });
});
