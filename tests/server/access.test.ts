import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Client, createStudio, createUser, signedIn, type TestUser } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

let admin: Client;
let teacher: Client;
let otherTeacher: Client;
let player: Client;
let outsider: Client;
let teacherUser: TestUser;
let playerUser: TestUser;
let studioId: string;
let otherStudioId: string;

beforeAll(async () => {
  teacherUser = await createUser(ctx.db, { role: 'teacher', name: 'Mara Quill' });
  const other = await createUser(ctx.db, { role: 'teacher' });
  playerUser = await createUser(ctx.db, { role: 'player', name: 'Theo Park' });
  const outsiderUser = await createUser(ctx.db, { role: 'player' });
  studioId = (await createStudio(ctx.db, teacherUser.id, [playerUser.id], 'Harbour Lane test')).id;
  otherStudioId = (await createStudio(ctx.db, other.id, [outsiderUser.id], 'Another studio')).id;
  [admin, teacher, otherTeacher, player, outsider] = await Promise.all([
    signedIn(ctx.app, await createUser(ctx.db, { role: 'admin' })),
    signedIn(ctx.app, teacherUser),
    signedIn(ctx.app, other),
    signedIn(ctx.app, playerUser),
    signedIn(ctx.app, outsiderUser),
  ]);
});

describe('GET /api/admin/users', () => {
  it('answers 401 when signed out', async () => {
    const res = await request(ctx.app).get('/api/admin/users');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('answers 403 to players and teachers', async () => {
    for (const c of [player, teacher]) {
      const res = await c.get('/api/admin/users');
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
  });

  it('lists every account for an admin, without hashes', async () => {
    const res = await admin.get('/api/admin/users').expect(200);
    const mara = res.body.users.find((u: { email: string }) => u.email === teacherUser.email);
    expect(mara).toEqual({
      id: teacherUser.id,
      email: teacherUser.email,
      name: 'Mara Quill',
      role: 'teacher',
      disabled: false,
      createdAt: expect.any(String),
    });
    expect(JSON.stringify(res.body)).not.toMatch(/argon|hash/i);
  });
});

describe('GET /api/dev/outbox', () => {
  it('is for admins: 401 signed out, 403 for other roles, 200 with messages for an admin', async () => {
    expect((await request(ctx.app).get('/api/dev/outbox')).status).toBe(401);
    expect((await player.get('/api/dev/outbox')).status).toBe(403);
    expect((await teacher.get('/api/dev/outbox')).status).toBe(403);
    const res = await admin.get('/api/dev/outbox').expect(200);
    expect(Array.isArray(res.body.messages)).toBe(true);
  });

  it('is absent in production', async () => {
    const prod = createTestApp({
      NODE_ENV: 'production',
      LOG_LEVEL: 'silent',
      SESSION_SECRET: 'a-production-secret-for-tests',
      PUBLIC_URL: 'https://sixfold.example',
      SMTP_HOST: '127.0.0.1',
      STRIPE_SECRET_KEY: 'sk_test_production_check',
      STRIPE_WEBHOOK_SECRET: 'whsec_production_check',
    });
    try {
      const res = await request(prod.app).get('/api/dev/outbox');
      expect(res.status).toBe(404);
    } finally {
      await prod.close();
    }
  });
});

describe("studios: another teacher's studio is not revealed", () => {
  it('answers 401 when signed out', async () => {
    expect((await request(ctx.app).get(`/api/studios/${studioId}`)).status).toBe(401);
  });

  it('shows the teacher their own studio with its players', async () => {
    const res = await teacher.get(`/api/studios/${studioId}`).expect(200);
    expect(res.body.studio).toMatchObject({
      id: studioId,
      name: 'Harbour Lane test',
      playerCount: 1,
      teacher: { id: teacherUser.id },
    });
    expect(res.body.studio.members.map((m: { name: string }) => m.name)).toEqual(['Theo Park']);
  });

  it('answers 404 to another teacher, exactly as for a studio that does not exist', async () => {
    const theirs = await otherTeacher.get(`/api/studios/${studioId}`);
    const none = await otherTeacher.get('/api/studios/00000000-0000-4000-8000-000000000000');
    expect(theirs.status).toBe(404);
    expect(none.status).toBe(404);
    expect(theirs.body).toEqual(none.body);
    expect((await otherTeacher.get('/api/studios/not-a-uuid')).status).toBe(404);
  });

  it('shows a member player their studio (without the member list); 404 to a player outside it', async () => {
    const res = await player.get(`/api/studios/${studioId}`).expect(200);
    expect(res.body.studio.name).toBe('Harbour Lane test');
    expect(res.body.studio.members).toBeUndefined();
    expect((await outsider.get(`/api/studios/${studioId}`)).status).toBe(404);
    expect((await player.get(`/api/studios/${otherStudioId}`)).status).toBe(404);
  });

  it('lists only the studios a user teaches or belongs to', async () => {
    const mine = await teacher.get('/api/studios').expect(200);
    expect(mine.body.studios.map((s: { id: string }) => s.id)).toEqual([studioId]);
    const theirs = await otherTeacher.get('/api/studios').expect(200);
    expect(theirs.body.studios.map((s: { id: string }) => s.id)).toEqual([otherStudioId]);
    const all = await admin.get('/api/studios').expect(200);
    expect(all.body.studios.map((s: { id: string }) => s.id)).toEqual(
      expect.arrayContaining([studioId, otherStudioId]),
    );
  });
});
