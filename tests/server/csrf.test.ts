import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { client, createUser, signedIn, TEST_PASSWORD, uniqueEmail } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

describe('CSRF', () => {
  it('GET /api/auth/csrf answers a token, the same one for the session', async () => {
    const agent = request.agent(ctx.app);
    const a = await agent.get('/api/auth/csrf').expect(200);
    const b = await agent.get('/api/auth/csrf').expect(200);
    expect(a.body.token).toEqual(expect.any(String));
    expect(a.body.token.length).toBeGreaterThanOrEqual(32);
    expect(b.body.token).toBe(a.body.token);
  });

  it('refuses a state-changing request with no token (403, code csrf)', async () => {
    const agent = request.agent(ctx.app);
    await agent.get('/api/auth/csrf');
    const res = await agent
      .post('/api/auth/sign-up')
      .send({ email: uniqueEmail(), password: TEST_PASSWORD, name: 'X', role: 'player' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf');
  });

  it('refuses a wrong token, and one from another session', async () => {
    const user = await createUser(ctx.db);
    const mine = await client(ctx.app);
    const theirs = await client(ctx.app);
    const wrong = await mine.agent
      .post('/api/auth/sign-in')
      .set('X-CSRF-Token', 'x'.repeat(43))
      .send({ email: user.email, password: user.password });
    expect(wrong.status).toBe(403);
    const borrowed = await mine.agent
      .post('/api/auth/sign-in')
      .set('X-CSRF-Token', theirs.csrf)
      .send({ email: user.email, password: user.password });
    expect(borrowed.status).toBe(403);
    expect(borrowed.body.error.code).toBe('csrf');
  });

  it('refuses a request with no session at all', async () => {
    const res = await request(ctx.app).post('/api/auth/sign-in').set('X-CSRF-Token', 'anything').send({});
    expect(res.status).toBe(403);
  });

  it('guards signed-in changes too (PATCH, sign-out) and the token changes at sign-in', async () => {
    const user = await createUser(ctx.db);
    const anon = await client(ctx.app);
    const before = anon.csrf;
    const c = await signedIn(ctx.app, user);
    expect(c.csrf).not.toBe(before);
    expect((await c.agent.patch('/api/auth/me').send({ name: 'No token' })).status).toBe(403);
    expect((await c.agent.post('/api/auth/sign-out')).status).toBe(403);
    // The session survived the refused sign-out.
    await c.get('/api/auth/me').expect(200);
  });

  it('lets GET through without a token', async () => {
    const user = await createUser(ctx.db);
    const c = await signedIn(ctx.app, user);
    await c.agent.get('/api/auth/me').expect(200);
  });

  it('exempts the payments webhook, which proves itself by signature', async () => {
    const res = await request(ctx.app).post('/api/payments/webhook').send({});
    expect(res.status).not.toBe(403);
  });
});
