import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { studioInvites } from '../../server/db/schema';
import {
  type Client,
  client,
  createStudio,
  createUser,
  signedIn,
  type TestUser,
  uniqueEmail,
  waitForMail,
} from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

let admin: Client;
let teacher: TestUser;
let t: Client;
let studioId: string;

beforeAll(async () => {
  teacher = await createUser(ctx.db, { role: 'teacher', name: 'Mara Quill' });
  studioId = (await createStudio(ctx.db, teacher.id, [], 'Harbour Lane invites')).id;
  [admin, t] = await Promise.all([
    signedIn(ctx.app, await createUser(ctx.db, { role: 'admin' })),
    signedIn(ctx.app, teacher),
  ]);
});

/** Invites the address and reads the token back from the e-mail in the fake's outbox. */
async function invite(email: string, nth = 1): Promise<{ token: string; text: string }> {
  await t.post(`/api/studios/${studioId}/invites`, { email }).expect(201);
  const mail = await waitForMail(admin, email, nth);
  const last = mail[mail.length - 1];
  const link = last.text.match(/https?:\/\/\S+\/invite\?token=([\w-]+)/);
  if (!link) throw new Error(`no invite link in: ${last.text}`);
  return { token: decodeURIComponent(link[1]), text: last.text };
}

describe('invites by e-mail', () => {
  it('sends the invited address a mail naming the studio and teacher, with a link to /invite', async () => {
    const email = uniqueEmail('invitee');
    const res = await t.post(`/api/studios/${studioId}/invites`, { email: email.toUpperCase() });
    expect(res.status).toBe(201);
    expect(res.body.invite).toMatchObject({ email, usedAt: null });
    const days = (Date.parse(res.body.invite.expiresAt) - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(6.9);
    expect(days).toBeLessThanOrEqual(7);
    const [mail] = await waitForMail(admin, email);
    expect(mail.to).toBe(email);
    expect(mail.subject).toContain('Harbour Lane invites');
    expect(mail.text).toContain('Mara Quill');
    expect(mail.text).toMatch(/\/invite\?token=[\w-]{40,}/);
    expect(mail.html).toContain('/invite?token=');
    const pending = await t.get(`/api/studios/${studioId}/invites`).expect(200);
    expect(pending.body.invites.map((i: { email: string }) => i.email)).toContain(email);
    // only the hash is stored
    const rows = await ctx.db.select().from(studioInvites).where(eq(studioInvites.email, email));
    expect(mail.text).not.toContain(rows[0].tokenHash);
  });

  it('a new address signs up through the link, joins, and the link then stops working', async () => {
    const email = uniqueEmail('newplayer');
    const { token } = await invite(email);
    const preview = await request(ctx.app).get(`/api/invites/${token}`).expect(200);
    expect(preview.body.invite).toMatchObject({
      studio: { id: studioId, name: 'Harbour Lane invites' },
      teacher: { name: 'Mara Quill' },
      email,
      accountExists: false,
    });

    const visitor = await client(ctx.app);
    const res = await visitor.post(`/api/invites/${token}/sign-up`, {
      name: 'Sam Okafor',
      password: 'wind-controller-9',
    });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email, name: 'Sam Okafor', role: 'player' });
    await visitor.refreshCsrf();
    const studios = await visitor.get('/api/studios').expect(200);
    expect(studios.body.studios.map((s: { id: string }) => s.id)).toEqual([studioId]);
    const detail = await t.get(`/api/studios/${studioId}`).expect(200);
    expect(detail.body.studio.players.map((p: { email: string }) => p.email)).toContain(email);

    // single use: the preview, accepting and signing up all refuse it now
    expect((await request(ctx.app).get(`/api/invites/${token}`)).status).toBe(404);
    const again = await client(ctx.app);
    expect(
      (await again.post(`/api/invites/${token}/sign-up`, { name: 'Someone', password: 'another-password' })).status,
    ).toBe(404);
    const p = await signedIn(ctx.app, await createUser(ctx.db, { role: 'player' }));
    expect((await p.post(`/api/invites/${token}/accept`)).status).toBe(404);
    // the teacher hears of it in the app
    const n = await t.get('/api/notifications').expect(200);
    expect(n.body.notifications[0]).toMatchObject({
      kind: 'joined',
      text: expect.stringContaining('Sam Okafor'),
      read: false,
    });
  });

  it('a signed-in player with an account accepts once', async () => {
    const player = await createUser(ctx.db, { role: 'player', name: 'Theo Park' });
    const { token } = await invite(player.email);
    expect((await request(ctx.app).get(`/api/invites/${token}`).expect(200)).body.invite.accountExists).toBe(true);
    const p = await signedIn(ctx.app, player);
    const res = await p.post(`/api/invites/${token}/accept`).expect(200);
    expect(res.body.studio).toEqual({ studioId, studioName: 'Harbour Lane invites' });
    expect((await p.get(`/api/studios/${studioId}`)).status).toBe(200);
    expect((await p.post(`/api/invites/${token}/accept`)).status).toBe(404);
    // signing up on an address that has an account is refused
    const { token: second } = await invite(player.email, 2);
    const visitor = await client(ctx.app);
    expect(
      (await visitor.post(`/api/invites/${second}/sign-up`, { name: 'Theo', password: 'whatever-123' })).status,
    ).toBe(409);
  });

  it('two answers to one link at the same moment: one joins, the other is refused', async () => {
    const { token } = await invite(uniqueEmail('race'));
    const [p1, p2] = await Promise.all([
      signedIn(ctx.app, await createUser(ctx.db, { role: 'player' })),
      signedIn(ctx.app, await createUser(ctx.db, { role: 'player' })),
    ]);
    const results = await Promise.all([
      p1.post(`/api/invites/${token}/accept`),
      p2.post(`/api/invites/${token}/accept`),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 404]);
  });

  it('an expired link does not work', async () => {
    const email = uniqueEmail('late');
    const { token } = await invite(email);
    await ctx.db
      .update(studioInvites)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(studioInvites.email, email));
    expect((await request(ctx.app).get(`/api/invites/${token}`)).status).toBe(404);
    const p = await signedIn(ctx.app, await createUser(ctx.db, { role: 'player' }));
    expect((await p.post(`/api/invites/${token}/accept`)).status).toBe(404);
    const visitor = await client(ctx.app);
    expect(
      (await visitor.post(`/api/invites/${token}/sign-up`, { name: 'Late', password: 'too-late-123' })).status,
    ).toBe(404);
  });

  it('refuses a bad address with a 400 that names the field, and a teacher account accepting', async () => {
    const res = await t.post(`/api/studios/${studioId}/invites`, { email: 'not-an-address' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.email).toBeDefined();
    const { token } = await invite(uniqueEmail('forteacher'));
    const other = await signedIn(ctx.app, await createUser(ctx.db, { role: 'teacher' }));
    expect((await other.post(`/api/invites/${token}/accept`)).status).toBe(403);
    expect((await request(ctx.app).get('/api/invites/not-a-real-token-at-all-xyz')).status).toBe(404);
  });
});
