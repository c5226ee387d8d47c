import { TakeResponse } from '../../shared/schemas/takes';
import { randomUUID } from 'node:crypto';
import { parseMidi } from 'midi-file';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DrillSpec, generateDrill, type PlayedNote } from '../../shared/engine';
import { type Client, createStudio, createUser, signedIn, type TestUser } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

const SPEC: DrillSpec = {
  pair: ['F', 'Eb'],
  pattern: 'weave',
  direction: 'up',
  instrument: 'piano',
  tempo: 120,
  range: { low: 60, high: 84 },
};
const drill = generateDrill(SPEC);
const msPerBeat = 60000 / 120;
const perfect: PlayedNote[] = drill.notes.map((n) => ({ midi: n.midi, timeMs: n.beat * msPerBeat, velocity: 80 }));

function takeBody(overrides: Record<string, unknown> = {}) {
  return {
    id: randomUUID(),
    spec: SPEC,
    played: perfect,
    options: { tempo: 120, mode: 'timed' },
    startedAt: new Date().toISOString(),
    ...overrides,
  };
}

let player: TestUser;
let other: TestUser;
let teacher: TestUser;
let outsider: TestUser;
let p: Client;
let o: Client;

beforeAll(async () => {
  player = await createUser(ctx.db, { role: 'player' });
  other = await createUser(ctx.db, { role: 'player' });
  teacher = await createUser(ctx.db, { role: 'teacher' });
  outsider = await createUser(ctx.db, { role: 'teacher' });
  await createStudio(ctx.db, teacher.id, [player.id]);
  p = await signedIn(ctx.app, player);
  o = await signedIn(ctx.app, other);
});

describe('POST /api/takes', () => {
  it('scores the raw notes on the server and stores the take', async () => {
    const body = takeBody();
    const res = await p.post('/api/takes', body);
    expect(res.status).toBe(201);
    // The answer holds to the one take contract the browser reads.
    const { take } = TakeResponse.parse(res.body);
    expect(take.id).toBe(body.id);
    expect(take.playerId).toBe(player.id);
    expect(take.score.accuracy).toBe(1);
    expect(take.score.results).toHaveLength(drill.notes.length);
    expect(take.played).toEqual(perfect);
    expect(take.measures).toBeNull();
    expect(take.key).toBe('F');
    expect(take.startedAt).toBe(body.startedAt.replace(/\.\d+Z$/, (m) => m));
    const rows = await ctx.pool.query('SELECT count(*)::int AS n FROM take_notes WHERE take_id = $1', [body.id]);
    expect(rows.rows[0].n).toBe(drill.notes.length);
  });

  it('scores a compound-meter drill with the tempo counting dotted quarters', async () => {
    // 6/8 at 120 dotted quarters a minute is 180 quarters a minute (common practice).
    const spec = { ...SPEC, meter: [6, 8] as [number, number], tempo: 120 };
    const sixEight = generateDrill(spec);
    const played = sixEight.notes.map((n) => ({ midi: n.midi, timeMs: (n.beat * 60000) / 180, velocity: 80 }));
    const res = await p.post('/api/takes', takeBody({ spec, played, options: { tempo: 120, mode: 'timed' } }));
    expect(res.status).toBe(201);
    expect(res.body.take.score.accuracy).toBe(1);
    expect(res.body.take.options.tempo).toBe(180);
  });

  it('stores a take sent twice once, answering 200 with the same take the second time', async () => {
    const body = takeBody();
    const first = await p.post('/api/takes', body);
    const second = await p.post('/api/takes', body);
    expect(first.status).toBe(201);
    expect(second.status).toBe(200);
    expect(second.body.take).toEqual(first.body.take);
    const fetched = TakeResponse.parse((await p.get(`/api/takes/${body.id}`).expect(200)).body);
    expect(fetched.take).toEqual(first.body.take);
    const rows = await ctx.pool.query('SELECT count(*)::int AS n FROM takes WHERE id = $1', [body.id]);
    expect(rows.rows[0].n).toBe(1);
  });

  it('never trusts a score from the client', async () => {
    const res = await p.post('/api/takes', { ...takeBody({ played: [] }), score: { accuracy: 1 } });
    // An unknown field is refused outright rather than quietly dropped.
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('_');
    const empty = await p.post('/api/takes', takeBody({ played: [] }));
    expect(empty.status).toBe(201);
    expect(empty.body.take.score.accuracy).toBe(0);
    expect(empty.body.take.score.results.every((r: { verdict: string }) => r.verdict === 'missed')).toBe(true);
  });

  it('bounds the windows and holds the tempo to the drill', async () => {
    const res = await p.post(
      '/api/takes',
      takeBody({ options: { tempo: 40, mode: 'timed', hitWindowMs: 5000, matchWindowMs: 9000 } }),
    );
    expect(res.status).toBe(201);
    expect(res.body.take.options).toMatchObject({ tempo: 120, hitWindowMs: 150, matchWindowMs: 400 });
    const low = await p.post('/api/takes', takeBody({ options: { tempo: 120, mode: 'timed', hitWindowMs: 1 } }));
    expect(low.body.take.options.hitWindowMs).toBe(20);
  });

  it('refuses more than 20,000 notes, naming the field', async () => {
    const many = Array.from({ length: 20_001 }, (_, i) => ({ midi: 60, timeMs: i }));
    const res = await p.post('/api/takes', takeBody({ played: many }));
    expect(res.status).toBe(400);
    expect(res.body.error.fields.played[0]).toMatch(/20,000/);
    expect(await p.post('/api/takes', takeBody({ played: many.slice(0, 20_000) })).then((r) => r.status)).toBe(201);
  });

  it.each([
    ['id', { id: 'not-a-uuid' }],
    ['spec.pair', { spec: { ...SPEC, pair: ['F', 'A'] } }],
    ['options.mode', { options: { tempo: 120, mode: 'loose' } }],
    ['played.0.midi', { played: [{ midi: 200, timeMs: 0 }] }],
    ['startedAt', { startedAt: 'yesterday' }],
  ])('answers 400 naming %s', async (field, patch) => {
    const res = await p.post('/api/takes', takeBody(patch));
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  it('scores a ladder step on its measures only', async () => {
    const res = await p.post('/api/takes', takeBody({ measures: [2, 2], played: [] }));
    expect(res.status).toBe(201);
    const inMeasure2 = drill.notes.filter((n) => n.measure === 2).length;
    expect(res.body.take.measures).toEqual([2, 2]);
    expect(res.body.take.score.results).toHaveLength(inMeasure2);
  });

  it('leaves the notes due after a stop out of the score and the maps', async () => {
    const stoppedAtMs = 2 * 4 * msPerBeat - 1; // just before measure 3
    const played = perfect.filter((n) => n.timeMs <= stoppedAtMs);
    const body = takeBody({ played, stoppedAtMs });
    const res = await p.post('/api/takes', body);
    expect(res.status).toBe(201);
    const due = drill.notes.filter((n) => n.beat * msPerBeat <= stoppedAtMs).length;
    expect(res.body.take.score.results).toHaveLength(due);
    expect(res.body.take.score.accuracy).toBe(1);
    const rows = await ctx.pool.query('SELECT max(measure)::int AS m FROM take_notes WHERE take_id = $1', [body.id]);
    expect(rows.rows[0].m).toBe(2);
  });

  it('is for players: signed out 401, a teacher 403', async () => {
    const anon = await request(ctx.app).get('/api/auth/csrf');
    const cookie = anon.headers['set-cookie'];
    const res = await request(ctx.app)
      .post('/api/takes')
      .set('Cookie', cookie)
      .set('X-CSRF-Token', anon.body.token)
      .send(takeBody());
    expect(res.status).toBe(401);
    const t = await signedIn(ctx.app, teacher);
    expect((await t.post('/api/takes', takeBody())).status).toBe(403);
  });
});

describe('GET, MIDI and DELETE /api/takes/:id', () => {
  let takeId: string;
  beforeAll(async () => {
    const body = takeBody();
    takeId = body.id;
    await p.post('/api/takes', body).expect(201);
  });

  it('shows the take to its player and their teacher, 404 to anyone else', async () => {
    expect((await p.get(`/api/takes/${takeId}`)).status).toBe(200);
    const t = await signedIn(ctx.app, teacher);
    expect((await t.get(`/api/takes/${takeId}`)).body.take.id).toBe(takeId);
    expect((await o.get(`/api/takes/${takeId}`)).status).toBe(404);
    const stranger = await signedIn(ctx.app, outsider);
    expect((await stranger.get(`/api/takes/${takeId}`)).status).toBe(404);
    expect((await p.get(`/api/takes/${randomUUID()}`)).status).toBe(404);
    expect((await request(ctx.app).get(`/api/takes/${takeId}`)).status).toBe(401);
  });

  it('exports a Standard MIDI File with a Drill and a Take track', async () => {
    const res = await p
      .get(`/api/takes/${takeId}/midi`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/audio\/midi/);
    // Read back with an independent parser (midi-file), per Standard MIDI Files 1.0.
    const midi = parseMidi(res.body as Buffer);
    const names = midi.tracks
      .map((t) => t.find((e) => e.type === 'trackName'))
      .map((e) => (e && 'text' in e ? e.text : null));
    expect(names).toContain('Drill');
    expect(names).toContain('Take');
    const takeTrack = midi.tracks[names.indexOf('Take')];
    const ons = takeTrack.filter((e) => e.type === 'noteOn' && 'velocity' in e && e.velocity > 0);
    expect(ons.map((e) => ('noteNumber' in e ? e.noteNumber : -1))).toEqual(perfect.map((n) => n.midi));
    expect((await o.get(`/api/takes/${takeId}/midi`)).status).toBe(404);
  });

  it("lets only the take's player delete it", async () => {
    const del = (c: Client) => c.agent.delete(`/api/takes/${takeId}`).set('X-CSRF-Token', c.csrf);
    expect((await del(o)).status).toBe(404);
    expect((await del(p)).status).toBe(204);
    expect((await p.get(`/api/takes/${takeId}`)).status).toBe(404);
    const rows = await ctx.pool.query('SELECT count(*)::int AS n FROM take_notes WHERE take_id = $1', [takeId]);
    expect(rows.rows[0].n).toBe(0);
  });
});
