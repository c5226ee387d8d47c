import { Writable } from 'node:stream';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { client, createUser, signedIn } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

// The app's request log, captured: one JSON line per request.
const lines: string[] = [];
const sink = new Writable({
  write(chunk, _enc, done) {
    lines.push(...String(chunk).split('\n').filter(Boolean));
    done();
  },
});
const ctx = createTestApp();
// The same deps, logging at the production level into the sink.
const app = createApp({ db: ctx.db, pool: ctx.pool, env: { ...ctx.env, LOG_LEVEL: 'info' }, logStream: sink as never });
afterAll(() => ctx.close());

describe('request log', () => {
  it('logs method, path and status for each request, and no password, cookie or token', async () => {
    const user = await createUser(ctx.db, { password: 'a-very-secret-phrase' });
    const c = await signedIn(app, user);
    const token = 'invite-token-that-must-not-be-logged';
    await c.get(`/api/invites/${token}?reset=another-secret-value`);
    const anon = await client(app);
    await anon.post('/api/auth/password-reset/confirm', { token: 'reset-token-secret', password: 'new-secret-phrase' });

    const entries = lines.map((l) => JSON.parse(l));
    expect(
      entries.some((e) => e.req?.method === 'POST' && e.req?.path === '/api/auth/sign-in' && e.res?.status === 200),
    ).toBe(true);
    expect(entries.some((e) => e.req?.path === '/api/invites/:token')).toBe(true);
    const all = lines.join('\n');
    for (const secret of [
      user.password,
      token,
      'another-secret-value',
      'reset-token-secret',
      'new-secret-phrase',
      c.csrf,
      'sixfold.sid',
    ])
      expect(all).not.toContain(secret);
  });
});
