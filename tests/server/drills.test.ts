import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { generateDrill, pairsForChord } from '../../shared/engine';
import type { DrillSpec, PatternDef } from '../../shared/schemas/drills';
import { type Client, createStudio, createUser, signedIn, type TestUser } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

const preview = (spec: unknown) =>
  request(ctx.app).get(`/api/drills/preview?spec=${encodeURIComponent(JSON.stringify(spec))}`);

const SPEC: DrillSpec = {
  pair: ['D', 'C'],
  pattern: 'four-three',
  direction: 'up',
  instrument: 'alto-sax',
  tempo: 100,
  chord: 'D7',
};

describe('GET /api/drills/preview', () => {
  it('returns the same drill the engine makes in the browser', async () => {
    const res = await preview(SPEC);
    expect(res.status).toBe(200);
    expect(res.body.drill).toEqual(JSON.parse(JSON.stringify(generateDrill(SPEC))));
    expect(res.body.drill.spec.instrument).toBe('alto-sax');
    expect(res.body.drill.notes.length).toBeGreaterThan(10);
  });

  it.each(['G7alt', 'C7#9b13', 'F7#9', 'Cmaj7#11', 'Bbm7b5'])(
    "previews the fit finder's first pair over %s",
    async (chord) => {
      const fit = pairsForChord(chord)[0];
      const spec = { ...SPEC, pair: [fit.pair.a.symbol, fit.pair.b.symbol], chord };
      const res = await preview(spec);
      expect(res.status).toBe(200);
      expect(res.body.drill.spec.chord).toBe(chord);
      expect(res.body.drill.spec.pair).toEqual(spec.pair);
    },
  );

  it('takes a custom pattern given in full', async () => {
    const def: PatternDef = {
      name: 'Up both',
      subdivision: 'sixteenth',
      source: 'triads',
      cells: [
        { triad: 'a', notes: 4, shape: 'line', motion: 'up', entry: 'start' },
        { triad: 'b', notes: 4, shape: 'line', motion: 'up', entry: 'above' },
      ],
    };
    const res = await preview({ ...SPEC, pattern: def });
    expect(res.status).toBe(200);
    expect(res.body.drill.notes[1].beat).toBe(0.25);
  });

  it.each([
    [{ ...SPEC, tempo: 10 }, 'tempo', /at least 20/],
    [{ ...SPEC, meter: [9, 8] }, 'meter', /4\/4/],
    [{ ...SPEC, instrument: 'banjo' }, 'instrument', /instrument/],
    [{ ...SPEC, range: { low: 80, high: 60 } }, 'range.low', /above/],
    [{ ...SPEC, direction: 'sideways' }, 'direction', /up, down or up-down/],
    [{ ...SPEC, chord: 'H7' }, 'chord', /chord symbol/],
    [
      { ...SPEC, pattern: { name: 'x', subdivision: 'triplet', source: 'triads', cells: [{ triad: 'c' }] } },
      'pattern',
      /./,
    ],
  ])('answers a bad field with a 400 naming it (%#)', async (spec, field, message) => {
    const res = await preview(spec);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation');
    const key = Object.keys(res.body.error.fields).find((k) => k === field || k.startsWith(`${field}.`));
    expect(key, JSON.stringify(res.body.error.fields)).toBeDefined();
    expect(res.body.error.fields[key!].join(' ')).toMatch(message);
  });

  it('names the pair when the triads share a note or one is not a triad', async () => {
    for (const pair of [
      ['D', 'Bm'],
      ['D', 'H'],
    ]) {
      const res = await preview({ ...SPEC, pair });
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual(['pair']);
      expect(res.body.error.message.length).toBeGreaterThan(10);
    }
  });

  it('names the range when the pattern cannot fit, and the start when only the start is wrong', async () => {
    const narrow = await preview({ ...SPEC, range: { low: 60, high: 64 } });
    expect(narrow.status).toBe(400);
    expect(Object.keys(narrow.body.error.fields)).toEqual(['range']);
    const late = await preview({ ...SPEC, start: 78 });
    expect(late.status).toBe(400);
    expect(Object.keys(late.body.error.fields)).toEqual(['start']);
  });

  it('answers a spec that is not JSON, or missing, with a 400 naming spec', async () => {
    const broken = await request(ctx.app).get('/api/drills/preview?spec=%7Bnope');
    expect(broken.status).toBe(400);
    expect(broken.body.error.fields).toHaveProperty('spec');
    const missing = await request(ctx.app).get('/api/drills/preview');
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields).toHaveProperty('spec');
  });
});

describe('saved drills and custom patterns', () => {
  let teacher: TestUser;
  let player: TestUser;
  let stranger: TestUser;
  let asTeacher: Client;
  let asPlayer: Client;
  let asStranger: Client;

  beforeAll(async () => {
    teacher = await createUser(ctx.db, { role: 'teacher', name: 'Mara Test' });
    player = await createUser(ctx.db, { role: 'player', name: 'Ines Test' });
    stranger = await createUser(ctx.db, { role: 'player', name: 'Other Test' });
    await createStudio(ctx.db, teacher.id, [player.id]);
    [asTeacher, asPlayer, asStranger] = await Promise.all([
      signedIn(ctx.app, teacher),
      signedIn(ctx.app, player),
      signedIn(ctx.app, stranger),
    ]);
  });

  it('asks a visitor to sign in', async () => {
    expect((await request(ctx.app).get('/api/drills')).status).toBe(401);
    expect((await request(ctx.app).get('/api/patterns')).status).toBe(401);
  });

  it('lets a player save, read, rename and delete their own drill', async () => {
    const created = await asPlayer.post('/api/drills', { name: 'D7 four-three', spec: SPEC, keyOrder: 'fourths' });
    expect(created.status).toBe(201);
    const drill = created.body.drill;
    expect(drill).toMatchObject({
      name: 'D7 four-three',
      spec: SPEC,
      keyOrder: 'fourths',
      mine: true,
      owner: { id: player.id, name: 'Ines Test' },
    });

    const got = await asPlayer.get(`/api/drills/${drill.id}`);
    expect(got.status).toBe(200);
    expect(got.body.drill.id).toBe(drill.id);

    const renamed = await asPlayer.patch(`/api/drills/${drill.id}`, { name: 'D7, slow', spec: { ...SPEC, tempo: 72 } });
    expect(renamed.status).toBe(200);
    expect(renamed.body.drill).toMatchObject({ name: 'D7, slow', spec: { tempo: 72 }, keyOrder: 'fourths' });

    const list = await asPlayer.get('/api/drills');
    expect(list.body.drills.map((d: { id: string }) => d.id)).toContain(drill.id);

    expect((await asPlayer.agent.delete(`/api/drills/${drill.id}`).set('X-CSRF-Token', asPlayer.csrf)).status).toBe(
      204,
    );
    expect((await asPlayer.get(`/api/drills/${drill.id}`)).status).toBe(404);
  });

  it('refuses a drill that cannot be played, naming the field', async () => {
    const res = await asPlayer.post('/api/drills', { name: 'Bad', spec: { ...SPEC, pair: ['D', 'F#m'] } });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['spec.pair']);
    const noName = await asPlayer.post('/api/drills', { name: ' ', spec: SPEC });
    expect(noName.status).toBe(400);
    expect(noName.body.error.fields).toHaveProperty('name');
  });

  it("answers another player's saved drill with 404, for reading and for changing", async () => {
    const mine = (await asPlayer.post('/api/drills', { name: 'Private', spec: SPEC })).body.drill;
    expect((await asStranger.get(`/api/drills/${mine.id}`)).status).toBe(404);
    expect((await asStranger.patch(`/api/drills/${mine.id}`, { name: 'Taken' })).status).toBe(404);
    expect((await asStranger.agent.delete(`/api/drills/${mine.id}`).set('X-CSRF-Token', asStranger.csrf)).status).toBe(
      404,
    );
    const list = await asStranger.get('/api/drills');
    expect(list.body.drills.map((d: { id: string }) => d.id)).not.toContain(mine.id);
    // The teacher of the player's studio does not see it either: only teachers' drills are shared.
    expect((await asTeacher.get(`/api/drills/${mine.id}`)).status).toBe(404);
    expect((await asPlayer.get('/api/drills/not-an-id')).status).toBe(404);
  });

  it("shows a teacher's saved drill to the studio's players, read-only", async () => {
    const set = (await asTeacher.post('/api/drills', { name: 'Tuesday: D/C over D7', spec: SPEC, keyOrder: 'fifths' }))
      .body.drill;
    const list = await asPlayer.get('/api/drills');
    const seen = list.body.drills.find((d: { id: string }) => d.id === set.id);
    expect(seen).toMatchObject({
      name: 'Tuesday: D/C over D7',
      mine: false,
      owner: { id: teacher.id, name: 'Mara Test', role: 'teacher' },
    });
    expect((await asPlayer.get(`/api/drills/${set.id}`)).status).toBe(200);
    expect((await asPlayer.patch(`/api/drills/${set.id}`, { name: 'Mine now' })).status).toBe(404);
    expect((await asStranger.get(`/api/drills/${set.id}`)).status).toBe(404);
  });

  it('keeps custom patterns the same way', async () => {
    const def: PatternDef = {
      name: 'Wide steps',
      subdivision: 'eighth',
      source: 'scale',
      degrees: [0, 2, 4, 1],
      step: 1,
    };
    const created = await asTeacher.post('/api/patterns', { name: 'Wide steps', def });
    expect(created.status).toBe(201);
    const id = created.body.pattern.id;
    expect(created.body.pattern).toMatchObject({ name: 'Wide steps', def, mine: true });
    const forPlayer = await asPlayer.get('/api/patterns');
    expect(forPlayer.body.patterns.find((p: { id: string }) => p.id === id)).toMatchObject({ mine: false });
    const readByPlayer = await asPlayer.get(`/api/patterns/${id}`);
    expect(readByPlayer.status).toBe(200);
    expect(readByPlayer.body.pattern).toMatchObject({ id, name: 'Wide steps', def, mine: false });
    expect((await asPlayer.patch(`/api/patterns/${id}`, { name: 'x' })).status).toBe(404);
    expect((await asStranger.get(`/api/patterns/${id}`)).status).toBe(404);
    const bad = await asTeacher.post('/api/patterns', { name: 'Bad', def: { ...def, degrees: [] } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toContain('def.degrees');
    const renamed = await asTeacher.patch(`/api/patterns/${id}`, { name: 'Wider steps' });
    expect(renamed.body.pattern.name).toBe('Wider steps');
    expect((await asTeacher.agent.delete(`/api/patterns/${id}`).set('X-CSRF-Token', asTeacher.csrf)).status).toBe(204);
    expect((await asTeacher.get(`/api/patterns/${id}`)).status).toBe(404);
  });
});
