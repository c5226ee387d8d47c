import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Client, createStudio, createUser, signedIn, type TestUser } from '../helpers/factories';
import { createSavedDrill, inDays, postTake, STUDIO_SPEC } from '../helpers/studio-fixtures';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

let teacherA: TestUser;
let teacherB: TestUser;
let playerA: TestUser;
let playerB: TestUser;
let a: Client;
let b: Client;
let pa: Client;
let pb: Client;
let outsider: Client;
let studioA: string;
let studioB: string;
let takeB: string;

beforeAll(async () => {
  teacherA = await createUser(ctx.db, { role: 'teacher', name: 'Mara Quill' });
  teacherB = await createUser(ctx.db, { role: 'teacher', name: 'Other Teacher' });
  playerA = await createUser(ctx.db, { role: 'player', name: 'Theo Park' });
  playerB = await createUser(ctx.db, { role: 'player', name: 'Ines Duarte' });
  studioA = (await createStudio(ctx.db, teacherA.id, [playerA.id], 'Harbour Lane A')).id;
  studioB = (await createStudio(ctx.db, teacherB.id, [playerB.id], 'Studio B')).id;
  [a, b, pa, pb, outsider] = await Promise.all([
    signedIn(ctx.app, teacherA),
    signedIn(ctx.app, teacherB),
    signedIn(ctx.app, playerA),
    signedIn(ctx.app, playerB),
    signedIn(ctx.app, await createUser(ctx.db, { role: 'player' })),
  ]);
  takeB = (await postTake(pb, STUDIO_SPEC)).id;
  await b.post(`/api/takes/${takeB}/remarks`, { body: 'Watch the top note', noteIndex: 3 }).expect(201);
});

describe('the API shapes outside checks use', () => {
  it('POST /api/studios makes a studio for a teacher; a player may not', async () => {
    const res = await a.post('/api/studios', { name: 'Thursday duo' }).expect(201);
    expect(res.body.studio).toMatchObject({
      name: 'Thursday duo',
      role: 'teacher',
      teacher: { id: teacherA.id, name: 'Mara Quill', email: teacherA.email },
      players: [],
    });
    expect((await pa.post('/api/studios', { name: 'Mine' })).status).toBe(403);
    const bad = await a.post('/api/studios', { name: '' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.name).toBeDefined();
  });

  it('GET /api/studios lists { id, name, role } for what I teach or belong to', async () => {
    const mine = await a.get('/api/studios').expect(200);
    const harbour = mine.body.studios.find((s: { id: string }) => s.id === studioA);
    expect(harbour).toMatchObject({ id: studioA, name: 'Harbour Lane A', role: 'teacher' });
    expect(mine.body.studios.some((s: { id: string }) => s.id === studioB)).toBe(false);
    const theirs = await pa.get('/api/studios').expect(200);
    expect(theirs.body.studios).toEqual([
      expect.objectContaining({ id: studioA, name: 'Harbour Lane A', role: 'player' }),
    ]);
  });

  it('GET /api/studios/:id gives the teacher and the players with e-mails', async () => {
    const res = await a.get(`/api/studios/${studioA}`).expect(200);
    expect(res.body.studio).toMatchObject({
      id: studioA,
      name: 'Harbour Lane A',
      teacher: { id: teacherA.id, name: 'Mara Quill', email: teacherA.email },
      players: [{ id: playerA.id, name: 'Theo Park', email: playerA.email }],
    });
  });

  it('GET /api/studios/:id/assignments answers { assignments: [...] } to the teacher and players', async () => {
    expect((await a.get(`/api/studios/${studioA}/assignments`).expect(200)).body).toEqual({ assignments: [] });
    expect((await pa.get(`/api/studios/${studioA}/assignments`).expect(200)).body).toEqual({ assignments: [] });
  });

  it('POST /api/studios/:id/invites: 403 for a player of the studio', async () => {
    const res = await pa.post(`/api/studios/${studioA}/invites`, { email: 'friend@test.sixfold.test' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
  });
});

describe('teacher A never reaches studio B', () => {
  it('answers 404 on every studio route, the same as for no studio at all', async () => {
    const none = '00000000-0000-4000-8000-000000000000';
    for (const c of [a, pa, outsider]) {
      for (const path of ['', '/assignments', '/board', '/invites', `/players/${playerB.id}`]) {
        const res = await c.get(`/api/studios/${studioB}${path}`);
        expect(res.status, `${path}`).toBe(404);
        expect(res.body).toEqual((await c.get(`/api/studios/${none}${path}`)).body);
      }
      expect((await c.post(`/api/studios/${studioB}/invites`, { email: 'x@test.sixfold.test' })).status).toBe(404);
      // an outsider's bad body still gets the 404, never a 400 that confirms the studio
      expect((await c.post(`/api/studios/${studioB}/invites`, {})).status).toBe(404);
      const drill = await createSavedDrill(ctx.db, teacherA.id);
      expect(
        (
          await c.post(`/api/studios/${studioB}/assignments`, {
            savedDrillId: drill.id,
            targetTempo: 100,
            targetAccuracy: 0.9,
            dueAt: inDays(7),
          })
        ).status,
      ).toBe(404);
    }
  });

  it("answers 404 for studio B's player, their takes and their remarks", async () => {
    expect((await a.get(`/api/studios/${studioA}/players/${playerB.id}`)).status).toBe(404);
    expect((await a.get(`/api/takes/${takeB}`)).status).toBe(404);
    expect((await a.get(`/api/takes/${takeB}/midi`)).status).toBe(404);
    expect((await a.get(`/api/takes/${takeB}/remarks`)).status).toBe(404);
    expect((await a.post(`/api/takes/${takeB}/remarks`, { body: 'Nice' })).status).toBe(404);
    // teacher B does see them
    const remarks = await b.get(`/api/takes/${takeB}/remarks`).expect(200);
    expect(remarks.body.remarks).toHaveLength(1);
  });

  it("answers 404 for studio B's player's maps and history (where those APIs exist)", async () => {
    for (const path of [`/api/maps/keys?player=${playerB.id}`, `/api/takes?player=${playerB.id}`]) {
      const res = await a.get(path);
      // 404 either way: the route refuses a player A does not teach, or does not exist yet
      expect([404], path).toContain(res.status);
    }
  });

  it("shows a teacher who teaches the player in both studios only their own studio's remarks", async () => {
    await ctx.db
      .insert((await import('../../server/db/schema')).studioMembers)
      .values({ studioId: studioA, playerId: playerB.id });
    const mine = await a.get(`/api/takes/${takeB}/remarks`).expect(200);
    expect(mine.body.remarks).toEqual([]);
    const own = await pb.get(`/api/takes/${takeB}/remarks`).expect(200);
    expect(own.body.remarks).toHaveLength(1);
  });

  it('answers 401 when signed out', async () => {
    expect((await request(ctx.app).get('/api/studios')).status).toBe(401);
    expect((await request(ctx.app).get(`/api/studios/${studioA}/assignments`)).status).toBe(401);
  });
});

describe('leaving a studio', () => {
  it('a player leaves; the teacher no longer sees them or their takes', async () => {
    const p = await createUser(ctx.db, { role: 'player' });
    await createStudio(ctx.db, teacherB.id, [p.id], 'Second studio for p');
    const studio = await createStudio(ctx.db, teacherA.id, [p.id], 'Leave me');
    const c = await signedIn(ctx.app, p);
    const take = await postTake(c, STUDIO_SPEC);
    await a.get(`/api/takes/${take.id}`).expect(200);
    expect((await c.agent.delete(`/api/studios/${studio.id}/membership`).set('X-CSRF-Token', c.csrf)).status).toBe(204);
    expect((await c.get(`/api/studios/${studio.id}`)).status).toBe(404);
    expect((await a.get(`/api/studios/${studio.id}/players/${p.id}`)).status).toBe(404);
    expect((await a.get(`/api/takes/${take.id}`)).status).toBe(404);
    // still in the other studio
    expect((await c.get('/api/studios').expect(200)).body.studios).toHaveLength(1);
  });
});
