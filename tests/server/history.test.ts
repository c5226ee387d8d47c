import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DrillSpec, generateDrill } from '../../shared/engine';
import { createTake } from '../../server/services/takes/create';
import { type Client, createStudio, createUser, signedIn, type TestUser } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

let player: TestUser;
let other: TestUser;
let teacher: TestUser;
let outsider: TestUser;
let p: Client;
const ids: Record<string, string> = {};

/** A take of the pair at a tempo, with the first `missing` notes left out. */
async function take(
  name: string,
  pair: [string, string],
  tempo: number,
  day: string,
  missing: number,
  playerId = player.id,
) {
  const spec: DrillSpec = { pair, pattern: 'four-three', direction: 'up', tempo, instrument: 'piano' };
  const drill = generateDrill(spec);
  const ms = 60000 / tempo;
  const played = drill.notes.slice(missing).map((n) => ({ midi: n.midi, timeMs: n.beat * ms }));
  const { take: row } = await createTake(ctx.db, {
    playerId,
    id: randomUUID(),
    spec,
    played,
    options: { tempo, mode: 'timed' },
    startedAt: new Date(`${day}T20:00:00Z`),
  });
  ids[name] = row.id;
}

beforeAll(async () => {
  player = await createUser(ctx.db, { role: 'player' });
  other = await createUser(ctx.db, { role: 'player' });
  teacher = await createUser(ctx.db, { role: 'teacher' });
  outsider = await createUser(ctx.db, { role: 'teacher' });
  await createStudio(ctx.db, teacher.id, [player.id]);
  await take('d1', ['D', 'C'], 100, '2026-02-01', 0);
  await take('b1', ['B', 'A'], 80, '2026-02-02', 6);
  await take('e1', ['E', 'D'], 120, '2026-02-03', 3);
  await take('d2', ['D', 'C'], 110, '2026-02-04', 1);
  await take('c1', ['C', 'D'], 90, '2026-02-05', 2);
  await take('x1', ['D', 'C'], 100, '2026-02-05', 0, other.id);
  p = await signedIn(ctx.app, player);
});

const names = (body: { takes: Array<{ id: string }> }) =>
  body.takes.map((t) => Object.keys(ids).find((k) => ids[k] === t.id));

describe('GET /api/takes', () => {
  it('lists the player’s own takes, newest first, with the summary columns', async () => {
    const res = await p.get('/api/takes').expect(200);
    expect(names(res.body)).toEqual(['c1', 'd2', 'e1', 'b1', 'd1']);
    expect(res.body).toMatchObject({ total: 5, page: 1, pageSize: 25 });
    expect(res.body.takes[4]).toMatchObject({
      pair: 'D/C',
      pattern: 'four-three',
      key: 'D',
      instrument: 'piano',
      tempo: 100,
      accuracy: 1,
      meanOffsetMs: 0,
      stopped: false,
      measures: null,
    });
    expect(res.body.takes[4].startedAt).toBe('2026-02-01T20:00:00.000Z');
  });

  it('sorts by accuracy, tempo and key (in C Db D ... B order) either way', async () => {
    expect(names((await p.get('/api/takes?sort=tempo&dir=asc').expect(200)).body)).toEqual([
      'b1',
      'c1',
      'd1',
      'd2',
      'e1',
    ]);
    const acc = (await p.get('/api/takes?sort=accuracy&dir=desc').expect(200)).body.takes.map(
      (t: { accuracy: number }) => t.accuracy,
    );
    expect(acc).toEqual([...acc].sort((a, b) => b - a));
    expect(acc[0]).toBe(1);
    expect(names((await p.get('/api/takes?sort=key&dir=asc').expect(200)).body)).toEqual([
      'c1',
      'd2',
      'd1',
      'e1',
      'b1',
    ]);
  });

  it('filters by key, pattern, pair, instrument and days', async () => {
    expect(names((await p.get('/api/takes?key=D').expect(200)).body)).toEqual(['d2', 'd1']);
    expect(names((await p.get('/api/takes?pair=B/A').expect(200)).body)).toEqual(['b1']);
    expect((await p.get('/api/takes?pattern=weave').expect(200)).body.total).toBe(0);
    expect((await p.get('/api/takes?instrument=piano').expect(200)).body.total).toBe(5);
    expect(names((await p.get('/api/takes?from=2026-02-02&to=2026-02-03').expect(200)).body)).toEqual(['e1', 'b1']);
  });

  it('pages, with the total that matched', async () => {
    const one = (await p.get('/api/takes?pageSize=2&page=1&sort=startedAt&dir=asc').expect(200)).body;
    const three = (await p.get('/api/takes?pageSize=2&page=3&sort=startedAt&dir=asc').expect(200)).body;
    expect(names(one)).toEqual(['d1', 'b1']);
    expect(names(three)).toEqual(['c1']);
    expect(three).toMatchObject({ total: 5, page: 3, pageSize: 2 });
  });

  it('says which query field is wrong', async () => {
    const res = await p.get('/api/takes?sort=loudness&pageSize=1000').expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['pageSize', 'sort']);
  });
});

describe('who sees which takes', () => {
  it('never shows a player another player’s takes', async () => {
    const o = await signedIn(ctx.app, other);
    expect(names((await o.get('/api/takes').expect(200)).body)).toEqual(['x1']);
    await o.get(`/api/takes?player=${player.id}`).expect(404);
    await o.get(`/api/takes/${ids.d1}`).expect(404);
    await o.get(`/api/takes/${ids.d1}/midi`).expect(404);
    await o.agent.delete(`/api/takes/${ids.d1}`).set('X-CSRF-Token', o.csrf).expect(404);
  });

  it('lets a teacher list their studio’s players only', async () => {
    const t = await signedIn(ctx.app, teacher);
    expect((await t.get(`/api/takes?player=${player.id}`).expect(200)).body.total).toBe(5);
    await t.get(`/api/takes?player=${other.id}`).expect(404);
    const x = await signedIn(ctx.app, outsider);
    await x.get(`/api/takes?player=${player.id}`).expect(404);
    await x.get(`/api/takes/${ids.d1}`).expect(404);
  });
});
