import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assignments, studioMembers, takes } from '../../server/db/schema';
import { type Client, createStudio, createUser, signedIn, type TestUser } from '../helpers/factories';
import { createSavedDrill, cycleSpecs, inDays, postTake, STUDIO_SPEC, takeBody } from '../helpers/studio-fixtures';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

let teacher: TestUser;
let player: TestUser;
let t: Client;
let p: Client;
let p2: Client;
let studioId: string;
let drillId: string;

beforeAll(async () => {
  teacher = await createUser(ctx.db, { role: 'teacher' });
  player = await createUser(ctx.db, { role: 'player', name: 'Theo Park' });
  const second = await createUser(ctx.db, { role: 'player', name: 'Ines Duarte' });
  studioId = (await createStudio(ctx.db, teacher.id, [player.id, second.id], 'Assignments studio')).id;
  drillId = (await createSavedDrill(ctx.db, teacher.id)).id;
  [t, p, p2] = await Promise.all([signedIn(ctx.app, teacher), signedIn(ctx.app, player), signedIn(ctx.app, second)]);
});

async function assign(body: Record<string, unknown> = {}) {
  const res = await t.post(`/api/studios/${studioId}/assignments`, {
    savedDrillId: drillId,
    targetTempo: 100,
    targetAccuracy: 0.9,
    dueAt: inDays(7),
    note: 'Slow and even',
    ...body,
  });
  if (res.status !== 201) throw new Error(`${res.status} ${JSON.stringify(res.body)}`);
  return res.body.assignment as { id: string; keys: string[]; spec: typeof STUDIO_SPEC };
}

/** A player who joins the studio now, with no takes yet. */
async function newMember() {
  const other = await createUser(ctx.db, { role: 'player' });
  await ctx.db.insert(studioMembers).values({ studioId, playerId: other.id });
  return signedIn(ctx.app, other);
}

async function statusOf(c: Client, id: string) {
  const res = await c.get(`/api/studios/${studioId}/assignments`).expect(200);
  return res.body.assignments.find((a: { id: string }) => a.id === id) as {
    status: string;
    keysMet: string[];
    players?: { playerId: string; status: string }[];
  };
}

describe('setting assignments', () => {
  it('copies the drill at the target tempo; a key cycle names its 12 keys in order', async () => {
    const one = await assign();
    expect(one.keys).toEqual(['D']);
    expect(one.spec.tempo).toBe(100);
    const cycle = await assign({ keyOrder: 'fourths' });
    expect(cycle.keys).toEqual(['D', 'G', 'C', 'F', 'Bb', 'Eb', 'Ab', 'Db', 'F#', 'B', 'E', 'A']);
    const mine = await p.get('/api/assignments').expect(200);
    expect(mine.body.assignments.map((a: { id: string }) => a.id)).toEqual(expect.arrayContaining([one.id, cycle.id]));
    expect(mine.body.assignments[0]).toMatchObject({
      status: 'open',
      studioName: 'Assignments studio',
      note: 'Slow and even',
    });
    expect(mine.body.assignments[0].players).toBeUndefined();
    // players are told in the app
    const n = await p.get('/api/notifications').expect(200);
    expect(n.body.notifications.some((x: { kind: string }) => x.kind === 'assignment')).toBe(true);
  });

  it("refuses another teacher's saved drill, a player setting one, and bad targets (naming the field)", async () => {
    const other = await createUser(ctx.db, { role: 'teacher' });
    const theirs = await createSavedDrill(ctx.db, other.id);
    const res = await t.post(`/api/studios/${studioId}/assignments`, {
      savedDrillId: theirs.id,
      targetTempo: 100,
      targetAccuracy: 0.9,
      dueAt: inDays(7),
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.savedDrillId).toBeDefined();
    const bad = await t.post(`/api/studios/${studioId}/assignments`, {
      savedDrillId: drillId,
      targetTempo: 5,
      targetAccuracy: 2,
      dueAt: 'soon',
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['dueAt', 'targetAccuracy', 'targetTempo']);
    expect(
      (
        await p.post(`/api/studios/${studioId}/assignments`, {
          savedDrillId: drillId,
          targetTempo: 100,
          targetAccuracy: 0.9,
          dueAt: inDays(7),
        })
      ).status,
    ).toBe(403);
  });
});

describe('"met": every key has a take of the same drill at the targets, made after it was set', () => {
  it('one key: a slow or sloppy take does not meet it, a take at the targets does', async () => {
    const a = await assign();
    expect((await statusOf(p, a.id)).status).toBe('open');
    await postTake(p, { ...STUDIO_SPEC, tempo: 90 }, { assignmentId: a.id });
    expect((await statusOf(p, a.id)).status).toBe('open');
    const sloppy = await postTake(p, STUDIO_SPEC, { assignmentId: a.id, miss: 6 });
    expect(sloppy.accuracy).toBeLessThan(0.9);
    expect((await statusOf(p, a.id)).status).toBe('open');
    await postTake(p, { ...STUDIO_SPEC, tempo: 104 }, { assignmentId: a.id });
    expect((await statusOf(p, a.id)).status).toBe('met');
    expect((await statusOf(p, a.id)).keysMet).toEqual(['D']);
    // the teacher sees it per player: met for one, open for the other
    const teacherView = await statusOf(t, a.id);
    expect(teacherView.players?.find((x) => x.playerId === player.id)?.status).toBe('met');
    expect(teacherView.players?.find((x) => x.playerId !== player.id)?.status).toBe('open');
    expect((await statusOf(p2, a.id)).status).toBe('open');
  });

  it('counts a take of the same drill whatever started it; another drill, a ladder step or a slower take does not', async () => {
    const a = await assign();
    const p2 = await newMember();
    // another pattern on the same pair, in the same key, at the targets
    await postTake(p2, { ...STUDIO_SPEC, pattern: 'weave' });
    // another direction
    await postTake(p2, { ...STUDIO_SPEC, direction: 'down' });
    // another pair in the same key (a minor triad first)
    await postTake(p2, { ...STUDIO_SPEC, pair: ['Dm', 'C'] });
    // slower than the target, and a ladder step of the drill (its first measure only)
    await postTake(p2, { ...STUDIO_SPEC, tempo: 96 });
    const step = await p2.post('/api/takes', { ...takeBody(STUDIO_SPEC), measures: [1, 1] });
    expect(step.status).toBe(201);
    expect((await statusOf(p2, a.id)).status).toBe('open');
    expect((await statusOf(p2, a.id)).keysMet).toEqual([]);
    // the same drill from the drills page (no assignment), on an alto saxophone: it counts
    await postTake(p2, { ...STUDIO_SPEC, instrument: 'alto-sax', range: { low: 61, high: 79 } });
    expect((await statusOf(p2, a.id)).status).toBe('met');
    expect((await statusOf(p2, a.id)).keysMet).toEqual(['D']);
  });

  it('a key cycle counts takes of the drill moved to each key, from any button, and faster ones', async () => {
    const a = await assign({ keyOrder: 'chromatic' });
    const specs = cycleSpecs(a.spec, 'chromatic');
    const o = await newMember();
    for (const [i, spec] of specs.entries())
      await postTake(o, { ...spec, tempo: 100 + i }, i % 2 ? { assignmentId: a.id } : {});
    expect((await statusOf(o, a.id)).keysMet).toHaveLength(12);
    expect((await statusOf(o, a.id)).status).toBe('met');
  });

  it('a take made before the assignment was set does not count', async () => {
    const a = await assign();
    const take = await postTake(p, STUDIO_SPEC, { assignmentId: a.id });
    await ctx.db
      .update(takes)
      .set({ createdAt: new Date(Date.now() - 3_600_000) })
      .where(eq(takes.id, take.id));
    expect((await statusOf(p, a.id)).status).toBe('open');
  });

  it('a key cycle is met only when all 12 keys are; past due and not met is overdue', async () => {
    const a = await assign({ keyOrder: 'fourths' });
    const specs = cycleSpecs(a.spec, 'fourths');
    for (const spec of specs.slice(0, 11)) await postTake(p, spec, { assignmentId: a.id });
    const partly = await statusOf(p, a.id);
    expect(partly.status).toBe('open');
    expect(partly.keysMet).toHaveLength(11);
    await ctx.db
      .update(assignments)
      .set({ dueAt: new Date(Date.now() - 60_000) })
      .where(eq(assignments.id, a.id));
    expect((await statusOf(p, a.id)).status).toBe('overdue');
    expect((await statusOf(t, a.id)).players?.find((x) => x.playerId === player.id)?.status).toBe('overdue');
    await postTake(p, specs[11], { assignmentId: a.id });
    expect((await statusOf(p, a.id)).status).toBe('met');
  });

  it('the studio table shows statuses, last practice and the accuracy trend', async () => {
    const board = await t.get(`/api/studios/${studioId}/board`).expect(200);
    const theo = board.body.rows.find((r: { player: { id: string } }) => r.player.id === player.id);
    expect(theo.lastPracticeAt).not.toBeNull();
    expect(theo.trend).toHaveLength(6);
    expect(theo.trend[5]).toBeGreaterThan(0.5);
    expect(theo.takesThisWeek).toBeGreaterThan(5);
    expect(Object.values(theo.statuses)).toContain('met');
    const ines = board.body.rows.find((r: { player: { id: string } }) => r.player.id !== player.id);
    expect(ines.lastPracticeAt).toBeNull();
    expect((await p.get(`/api/studios/${studioId}/board`)).status).toBe(403);
    const detail = await t.get(`/api/studios/${studioId}/players/${player.id}`).expect(200);
    expect(detail.body.takes.length).toBeGreaterThan(5);
    // The player's page tells each assignment's status as the studio table does.
    expect(detail.body.assignments.length).toBeGreaterThan(0);
    for (const a of detail.body.assignments as Array<{ id: string; status: string }>) {
      expect(['met', 'open', 'overdue']).toContain(a.status);
      expect(a.status).toBe(theo.statuses[a.id]);
    }
  });
});

describe('week over week for an assignment', () => {
  it("gives the teacher each player's weeks and a player their own, counting takes from any button", async () => {
    const a = await assign({ keyOrder: 'fourths' });
    const specs = cycleSpecs(a.spec, 'fourths');
    const o = await newMember();
    await postTake(o, { ...specs[1], tempo: 96 });
    await postTake(o, specs[2], { assignmentId: a.id, miss: 4 });
    await postTake(o, { ...STUDIO_SPEC, pattern: 'weave' }); // another drill: not counted
    const mine = await o.get(`/api/assignments/${a.id}/weekly?tz=UTC`).expect(200);
    expect(mine.body.weeks).toHaveLength(6);
    expect(mine.body.players).toHaveLength(1);
    const week = mine.body.players[0].weeks.at(-1);
    expect(week.takes).toBe(2);
    expect(week.tempo).toBe(100);
    expect(week.accuracy).toBeGreaterThan(0.5);
    expect(week.accuracy).toBeLessThan(1);
    expect(mine.body.players[0].weeks[0]).toMatchObject({ takes: 0, accuracy: null, tempo: null });
    const all = await t.get(`/api/assignments/${a.id}/weekly`).expect(200);
    expect(all.body.players.length).toBeGreaterThanOrEqual(3);
    const outsider = await signedIn(ctx.app, await createUser(ctx.db, { role: 'player' }));
    await outsider.get(`/api/assignments/${a.id}/weekly`).expect(404);
    await o.get(`/api/assignments/${a.id}/weekly?tz=Atlantis`).expect(400);
    await o.get('/api/assignments/not-an-id/weekly').expect(400);
  });
});
