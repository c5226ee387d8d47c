import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { passwordResets } from '../../server/db/schema';
import { type Client, client, createUser, signedIn, uniqueEmail, waitForMail } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
let admin: Client;
beforeAll(async () => {
  admin = await signedIn(ctx.app, await createUser(ctx.db, { role: 'admin', name: 'Desk' }));
});
afterAll(() => ctx.close());

function tokenFrom(text: string): string {
  const match = text.match(/\/reset-password\?token=([A-Za-z0-9_%-]+)/);
  if (!match) throw new Error(`no reset link in: ${text}`);
  return decodeURIComponent(match[1]);
}

describe('password reset by e-mail', () => {
  it('answers the same whether or not the address has an account', async () => {
    const user = await createUser(ctx.db);
    const c = await client(ctx.app);
    const known = await c.post('/api/auth/password-reset', { email: user.email });
    const unknown = await c.post('/api/auth/password-reset', { email: uniqueEmail('nobody') });
    expect(known.status).toBe(200);
    expect(unknown.status).toBe(known.status);
    expect(unknown.body).toEqual(known.body);
    await waitForMail(admin, user.email);
  });

  it('names a bad address with a 400', async () => {
    const c = await client(ctx.app);
    const res = await c.post('/api/auth/password-reset', { email: 'not an address' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['email']);
  });

  it('mails a link through the fake SMTP server that works once', async () => {
    const user = await createUser(ctx.db, { name: 'Theo Park' });
    const old = await signedIn(ctx.app, user);
    const c = await client(ctx.app);
    await c.post('/api/auth/password-reset', { email: user.email }).expect(200);

    const [mail] = await waitForMail(admin, user.email);
    expect(mail.to).toBe(user.email);
    expect(mail.subject).toMatch(/password/i);
    expect(mail.text).toMatch(/Hi Theo/);
    expect(mail.html).toContain('/reset-password?token=');
    expect(Date.parse(mail.sentAt)).not.toBeNaN();
    const token = tokenFrom(mail.text);
    // Only the hash is stored.
    const rows = await ctx.db.select().from(passwordResets).where(eq(passwordResets.tokenHash, token));
    expect(rows).toHaveLength(0);

    const first = await c.post('/api/auth/password-reset/confirm', { token, password: 'harbour-lane-new' });
    expect(first.status).toBe(200);
    const second = await c.post('/api/auth/password-reset/confirm', { token, password: 'harbour-lane-again' });
    expect(second.status).toBe(400);
    expect(Object.keys(second.body.error.fields)).toEqual(['token']);

    // The new password works, the old one does not, and sessions from before are over.
    expect((await old.get('/api/auth/me')).status).toBe(401);
    const fresh = await client(ctx.app);
    expect((await fresh.post('/api/auth/sign-in', { email: user.email, password: user.password })).status).toBe(401);
    expect((await fresh.post('/api/auth/sign-in', { email: user.email, password: 'harbour-lane-new' })).status).toBe(
      200,
    );
  });

  it('builds the link from the server itself, never from a forged Host or X-Forwarded-Host', async () => {
    const user = await createUser(ctx.db);
    const c = await client(ctx.app);
    await c.agent
      .post('/api/auth/password-reset')
      .set('Host', 'evil.example')
      .set('X-Forwarded-Host', 'evil.example')
      .set('X-CSRF-Token', c.csrf)
      .send({ email: user.email })
      .expect(200);
    const [mail] = await waitForMail(admin, user.email);
    expect(mail.text).not.toContain('evil.example');
    expect(mail.html).not.toContain('evil.example');
    // No PUBLIC_URL here: the link names this server's HOST and the port it listens on.
    expect(mail.text).toMatch(/http:\/\/127\.0\.0\.1:\d+\/reset-password\?token=/);
  });

  it('uses PUBLIC_URL when it is set', async () => {
    const pub = createTestApp({ PUBLIC_URL: 'https://practice.sixfold.example' });
    try {
      const user = await createUser(pub.db);
      const c = await client(pub.app);
      await c.agent
        .post('/api/auth/password-reset')
        .set('Host', 'evil.example')
        .set('X-CSRF-Token', c.csrf)
        .send({ email: user.email })
        .expect(200);
      const [mail] = await waitForMail(admin, user.email);
      expect(mail.text).toContain('https://practice.sixfold.example/reset-password?token=');
    } finally {
      await pub.close();
    }
  });

  it('refuses an expired link', async () => {
    const user = await createUser(ctx.db);
    const c = await client(ctx.app);
    await c.post('/api/auth/password-reset', { email: user.email }).expect(200);
    const [mail] = await waitForMail(admin, user.email);
    await ctx.db
      .update(passwordResets)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(passwordResets.userId, user.id));
    const res = await c.post('/api/auth/password-reset/confirm', {
      token: tokenFrom(mail.text),
      password: 'too-late-for-this',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.token).toBeDefined();
  });

  it('sets links to expire in an hour', async () => {
    const user = await createUser(ctx.db);
    const c = await client(ctx.app);
    await c.post('/api/auth/password-reset', { email: user.email }).expect(200);
    // The link is made after the answer (so every answer takes the same time): the mail marks it done.
    await waitForMail(admin, user.email);
    const [row] = await ctx.db.select().from(passwordResets).where(eq(passwordResets.userId, user.id));
    const minutes = (row.expiresAt.getTime() - row.createdAt.getTime()) / 60_000;
    expect(minutes).toBeGreaterThan(59);
    expect(minutes).toBeLessThanOrEqual(60.1);
  });

  it('refuses a made-up token and names bad fields', async () => {
    const c = await client(ctx.app);
    const made = await c.post('/api/auth/password-reset/confirm', {
      token: 'x'.repeat(43),
      password: 'whatever-new-one',
    });
    expect(made.status).toBe(400);
    expect(made.body.error.fields.token).toBeDefined();
    const bad = await c.post('/api/auth/password-reset/confirm', { password: 'x' });
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['password', 'token']);
  });

  it('sends nothing for a switched-off account', async () => {
    const user = await createUser(ctx.db, { disabled: true });
    const c = await client(ctx.app);
    await c.post('/api/auth/password-reset', { email: user.email }).expect(200);
    const rows = await ctx.db.select().from(passwordResets).where(eq(passwordResets.userId, user.id));
    expect(rows).toHaveLength(0);
  });
});
