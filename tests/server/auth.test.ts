import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { users } from '../../server/db/schema';
import { client, createUser, signedIn, TEST_PASSWORD, uniqueEmail } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

function cookieNamed(res: request.Response, name: string): string | undefined {
  const raw = res.headers['set-cookie'] as unknown as string[] | undefined;
  return raw?.find((c) => c.startsWith(`${name}=`));
}

const sessionCookie = (res: request.Response) => cookieNamed(res, 'sixfold.sid');

describe('POST /api/auth/sign-up', () => {
  it('creates a player, signs them in, and never returns the hash', async () => {
    const c = await client(ctx.app);
    const email = uniqueEmail('new-player');
    const res = await c.post('/api/auth/sign-up', {
      email: email.toUpperCase(),
      password: TEST_PASSWORD,
      name: 'Theo Park',
      role: 'player',
    });
    expect(res.status).toBe(201);
    expect(res.body.user).toEqual({ id: expect.any(String), email, name: 'Theo Park', role: 'player' });
    expect(JSON.stringify(res.body)).not.toMatch(/hash|argon/i);
    const me = await c.get('/api/auth/me').expect(200);
    expect(me.body.user.email).toBe(email);
    const [row] = await ctx.db.select().from(users).where(eq(users.email, email));
    expect(row.passwordHash).toMatch(/^\$argon2id\$/);
  });

  it('creates a teacher', async () => {
    const c = await client(ctx.app);
    const res = await c.post('/api/auth/sign-up', {
      email: uniqueEmail('new-teacher'),
      password: TEST_PASSWORD,
      name: 'Mara Quill',
      role: 'teacher',
    });
    expect(res.status).toBe(201);
    expect(res.body.user.role).toBe('teacher');
  });

  it('refuses the admin role with a 400 naming the field', async () => {
    const c = await client(ctx.app);
    const res = await c.post('/api/auth/sign-up', {
      email: uniqueEmail(),
      password: TEST_PASSWORD,
      name: 'Sneaky',
      role: 'admin',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation');
    expect(Object.keys(res.body.error.fields)).toEqual(['role']);
  });

  it('names every bad field', async () => {
    const c = await client(ctx.app);
    const res = await c.post('/api/auth/sign-up', { email: 'not-an-address', password: 'short', name: '  ' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'name', 'password', 'role']);
    for (const messages of Object.values(res.body.error.fields))
      expect((messages as string[])[0]).toEqual(expect.any(String));
  });

  it('answers 409 on an address already in use, naming the field', async () => {
    const user = await createUser(ctx.db);
    const c = await client(ctx.app);
    const res = await c.post('/api/auth/sign-up', {
      email: user.email,
      password: TEST_PASSWORD,
      name: 'Again',
      role: 'player',
    });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.email).toBeDefined();
  });
});

describe('POST /api/auth/sign-in', () => {
  it('signs in, answers the user, and sets an HttpOnly SameSite=Lax cookie', async () => {
    const user = await createUser(ctx.db, { role: 'teacher', name: 'Mara Quill' });
    const c = await client(ctx.app);
    const res = await c.post('/api/auth/sign-in', { email: user.email, password: user.password });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ user: { id: user.id, email: user.email, name: 'Mara Quill', role: 'teacher' } });
    const cookie = sessionCookie(res)!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
  });

  it('marks the cookie Secure when served over HTTPS (behind a trusted proxy)', async () => {
    const proxied = createTestApp({ TRUST_PROXY: '1' });
    try {
      const user = await createUser(proxied.db);
      // The cookies are Secure, so a client on plain HTTP would not send them back: carry them by hand.
      const csrf = await request(proxied.app).get('/api/auth/csrf').set('X-Forwarded-Proto', 'https');
      const anonCookie = cookieNamed(csrf, 'sixfold.csrf');
      expect(anonCookie).toMatch(/;\s*Secure/i);
      const res = await request(proxied.app)
        .post('/api/auth/sign-in')
        .set('X-Forwarded-Proto', 'https')
        .set('Cookie', anonCookie!.split(';')[0])
        .set('X-CSRF-Token', csrf.body.token)
        .send({ email: user.email, password: user.password });
      expect(res.status).toBe(200);
      expect(sessionCookie(res)).toMatch(/;\s*Secure/i);
    } finally {
      await proxied.close();
    }
  });

  it('in production the cookies are always Secure (COOKIE_SECURE defaults to 1 there)', async () => {
    const prod = createTestApp({
      NODE_ENV: 'production',
      LOG_LEVEL: 'silent',
      TRUST_PROXY: '1',
      SESSION_SECRET: 'a-production-secret-for-tests',
      PUBLIC_URL: 'https://sixfold.example',
      SMTP_HOST: '127.0.0.1',
      STRIPE_SECRET_KEY: 'sk_test_sixfold_local_fake',
      STRIPE_WEBHOOK_SECRET: 'whsec_sixfold_local_fake',
    });
    try {
      const user = await createUser(prod.db);
      const csrf = await request(prod.app).get('/api/auth/csrf').set('X-Forwarded-Proto', 'https');
      const anonCookie = cookieNamed(csrf, 'sixfold.csrf')!;
      expect(anonCookie).toMatch(/;\s*Secure/i);
      const res = await request(prod.app)
        .post('/api/auth/sign-in')
        .set('X-Forwarded-Proto', 'https')
        .set('Cookie', anonCookie.split(';')[0])
        .set('X-CSRF-Token', csrf.body.token)
        .send({ email: user.email, password: user.password });
      expect(res.status).toBe(200);
      expect(sessionCookie(res)).toMatch(/;\s*Secure/i);
      expect(res.headers['strict-transport-security']).toMatch(/max-age=\d+/);
    } finally {
      await prod.close();
    }
  });

  it('gives a new session id at sign-in (no session fixation)', async () => {
    const user = await createUser(ctx.db);
    const c = await client(ctx.app);
    const first = await c.post('/api/auth/sign-in', { email: user.email, password: user.password });
    const before = sessionCookie(first)!.split(';')[0];
    await c.refreshCsrf();
    const res = await c.post('/api/auth/sign-in', { email: user.email, password: user.password });
    expect(res.status).toBe(200);
    const after = sessionCookie(res)!.split(';')[0];
    expect(after).not.toBe(before);
    // The old id is no good any more.
    const old = await request(ctx.app).get('/api/auth/me').set('Cookie', before);
    expect(old.status).toBe(401);
  });

  it('answers 401 on a wrong password and on an unknown address, alike', async () => {
    const user = await createUser(ctx.db);
    const c = await client(ctx.app);
    const wrong = await c.post('/api/auth/sign-in', { email: user.email, password: 'not-the-password' });
    const unknown = await c.post('/api/auth/sign-in', { email: uniqueEmail('nobody'), password: 'whatever-it-is' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.message).toBe(unknown.body.error.message);
    expect((await c.get('/api/auth/me')).status).toBe(401);
  });

  it('names bad fields with a 400', async () => {
    const c = await client(ctx.app);
    const res = await c.post('/api/auth/sign-in', { email: 'nope' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'password']);
  });

  it('refuses a switched-off account, and its open session stops working', async () => {
    const user = await createUser(ctx.db);
    const c = await signedIn(ctx.app, user);
    await c.get('/api/auth/me').expect(200);
    await ctx.db.update(users).set({ disabled: true }).where(eq(users.id, user.id));
    expect((await c.get('/api/auth/me')).status).toBe(401);
    expect((await c.get('/api/auth/session')).body).toEqual({ user: null });
    const again = await (await client(ctx.app)).post('/api/auth/sign-in', {
      email: user.email,
      password: user.password,
    });
    expect(again.status).toBe(401);
  });
});

describe('GET /api/auth/me and /api/auth/session', () => {
  it('me answers 401 when signed out; session answers null', async () => {
    expect((await request(ctx.app).get('/api/auth/me')).status).toBe(401);
    const s = await request(ctx.app).get('/api/auth/session');
    expect(s.status).toBe(200);
    expect(s.body).toEqual({ user: null });
  });

  it('me answers the signed-in user', async () => {
    const user = await createUser(ctx.db, { role: 'teacher' });
    const c = await signedIn(ctx.app, user);
    const res = await c.get('/api/auth/me').expect(200);
    expect(res.body.user).toEqual({ id: user.id, email: user.email, name: user.name, role: 'teacher' });
  });
});

describe('POST /api/auth/sign-out', () => {
  it('ends the session: the same cookie no longer works', async () => {
    const user = await createUser(ctx.db);
    const c = await signedIn(ctx.app, user);
    const me = await c.get('/api/auth/me').expect(200);
    const cookie = (me.request as unknown as { cookies: string }).cookies;
    const res = await c.post('/api/auth/sign-out');
    expect(res.status).toBe(200);
    expect((await c.get('/api/auth/me')).status).toBe(401);
    // Even a copy of the old cookie is refused: the session is gone from the store.
    if (cookie) expect((await request(ctx.app).get('/api/auth/me').set('Cookie', cookie)).status).toBe(401);
  });

  it('answers 401 when already signed out', async () => {
    const c = await client(ctx.app);
    expect((await c.post('/api/auth/sign-out')).status).toBe(401);
  });
});

describe('account settings', () => {
  it('changes the name', async () => {
    const user = await createUser(ctx.db);
    const c = await signedIn(ctx.app, user);
    const res = await c.patch('/api/auth/me', { name: '  Ines Duarte ' });
    expect(res.status).toBe(200);
    expect(res.body.user.name).toBe('Ines Duarte');
    expect((await c.patch('/api/auth/me', { name: '' })).body.error.fields.name).toBeDefined();
  });

  it('changes the password after checking the current one; other sessions end', async () => {
    const user = await createUser(ctx.db);
    const c = await signedIn(ctx.app, user);
    const other = await signedIn(ctx.app, user);
    const wrong = await c.post('/api/auth/password', {
      currentPassword: 'not-it-at-all',
      newPassword: 'a-brand-new-one',
    });
    expect(wrong.status).toBe(400);
    expect(Object.keys(wrong.body.error.fields)).toEqual(['currentPassword']);
    const short = await c.post('/api/auth/password', { currentPassword: user.password, newPassword: 'x' });
    expect(Object.keys(short.body.error.fields)).toEqual(['newPassword']);

    const res = await c.post('/api/auth/password', { currentPassword: user.password, newPassword: 'a-brand-new-one' });
    expect(res.status).toBe(200);
    await c.get('/api/auth/me').expect(200);
    expect((await other.get('/api/auth/me')).status).toBe(401);
    const fresh = await client(ctx.app);
    expect((await fresh.post('/api/auth/sign-in', { email: user.email, password: user.password })).status).toBe(401);
    expect((await fresh.post('/api/auth/sign-in', { email: user.email, password: 'a-brand-new-one' })).status).toBe(
      200,
    );
  });

  it('answers 401 to account changes when signed out', async () => {
    const c = await client(ctx.app);
    expect((await c.patch('/api/auth/me', { name: 'X' })).status).toBe(401);
    expect((await c.post('/api/auth/password', { currentPassword: 'a', newPassword: 'bbbbbbbbbb' })).status).toBe(401);
  });
});
