import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DrillSpec, generateDrill, type PlayedNote } from '../../shared/engine';
import { type Client, createStudio, createUser, signedIn, type TestUser } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

// common practice: a ii-V-I in C, the V pinned to its altered pair
const SPEC: DrillSpec = {
  pattern: 'weave',
  direction: 'up',
  instrument: 'piano',
  tempo: 120,
  changes: [
    { chord: 'Dm7', beats: 4 },
    { chord: 'G7', beats: 4, pair: ['Db', 'Eb'] },
    { chord: 'Cmaj7', beats: 8 },
  ],
  choruses: 2,
};
const drill = generateDrill(SPEC);
const msPerBeat = 60000 / 120;
// every note played, except the G7 bars' notes a half step off (wrong)
const played: PlayedNote[] = drill.notes.map((n) => {
  const chord = drill.changes?.[n.chordIndex as number].chord;
  return { midi: chord === 'G7' ? n.midi + 1 : n.midi, timeMs: n.beat * msPerBeat, velocity: 80 };
});

let player: TestUser;
let teacher: TestUser;
let p: Client;
let t: Client;
let takeId: string;

beforeAll(async () => {
  player = await createUser(ctx.db, { role: 'player' });
  teacher = await createUser(ctx.db, { role: 'teacher' });
  await createStudio(ctx.db, teacher.id, [player.id], 'Progressions studio');
  [p, t] = await Promise.all([signedIn(ctx.app, player), signedIn(ctx.app, teacher)]);
});

describe('a take of a progression drill', () => {
  it('is scored on the server and keeps the progression', async () => {
    takeId = randomUUID();
    const res = await p.post('/api/takes', {
      id: takeId,
      spec: SPEC,
      played,
      options: { tempo: 120, mode: 'timed' },
      startedAt: new Date().toISOString(),
    });
    expect(res.status).toBe(201);
    const { take } = res.body;
    expect(take.spec.changes).toEqual(SPEC.changes);
    expect(take.spec.choruses).toBe(2);
    expect(take.score.results).toHaveLength(drill.notes.length);
    const g7 = drill.notes.filter((n) => drill.changes?.[n.chordIndex as number].chord === 'G7').length;
    expect(take.score.accuracy).toBeCloseTo((drill.notes.length - g7) / drill.notes.length, 9);
    // the take's key is its first chord's root
    expect(take.key).toBe('D');
    const again = await p.get(`/api/takes/${takeId}`).expect(200);
    expect(again.body.take.spec.changes).toEqual(SPEC.changes);
  });

  it('counts each chord in its own key in the key map', async () => {
    const per = (chord: string) =>
      drill.notes.filter((n) => drill.changes?.[n.chordIndex as number].chord === chord).length;
    const rows = await ctx.pool.query(
      'SELECT key, pair, count(*)::int AS n FROM take_notes WHERE take_id = $1 GROUP BY 1, 2 ORDER BY 1, 2',
      [takeId],
    );
    const byKey = Object.fromEntries(rows.rows.map((r) => [r.key, r.n]));
    expect(byKey).toEqual({ C: per('Cmaj7'), D: per('Dm7'), G: per('G7') });
    // the pinned pair is the G7 notes' pair
    expect(rows.rows.find((r) => r.key === 'G')?.pair).toBe('Db/Eb');
    const map = await p.get('/api/maps/keys').expect(200);
    const cells = Object.fromEntries(
      (map.body.cells as { key: string; notes: number; errors: number }[]).map((c) => [c.key, c]),
    );
    expect(cells.D).toMatchObject({ notes: per('Dm7'), errors: 0 });
    expect(cells.G).toMatchObject({ notes: per('G7'), errors: per('G7') });
    expect(cells.C).toMatchObject({ notes: per('Cmaj7'), errors: 0 });
  });

  it('"what next" suggests the progression in a key not yet played', async () => {
    const { items } = (await p.get('/api/maps/next').expect(200)).body;
    const unplayed = items.filter((i: { reason: string }) => i.reason === 'unpractised');
    expect(unplayed.length).toBeGreaterThan(0);
    for (const item of unplayed) {
      expect(item.pattern).toBe('weave');
      expect(['C', 'D', 'G']).not.toContain(item.key);
      // the progression moved so its first chord is in the suggested key
      expect(item.spec.changes).toHaveLength(3);
      expect(item.spec.changes[0].chord).toBe(`${item.key}m7`);
    }
  });

  it('refuses a progression with a chord Sixfold cannot read, naming it', async () => {
    const res = await p.post('/api/takes', {
      id: randomUUID(),
      spec: {
        ...SPEC,
        changes: [
          { chord: 'Dm7', beats: 4 },
          { chord: 'Hq7', beats: 4 },
        ],
      },
      played,
      options: { tempo: 120, mode: 'timed' },
      startedAt: new Date().toISOString(),
    });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.error.fields)).toMatch(/Hq7/);
    const noPair = await p.post('/api/takes', {
      id: randomUUID(),
      spec: { pattern: 'weave', direction: 'up' },
      played,
      options: { tempo: 120, mode: 'timed' },
      startedAt: new Date().toISOString(),
    });
    expect(noPair.status).toBe(400);
  });
});

describe('saved drills, assignments and books over a progression', () => {
  it('saves a progression drill, assigns it through the key cycle and puts it in a book', async () => {
    const saved = await t.post('/api/drills', { name: 'ii-V-I, weave', spec: SPEC, keyOrder: 'fourths' });
    expect(saved.status).toBe(201);
    expect(saved.body.drill.spec.changes).toEqual(SPEC.changes);
    const id: string = saved.body.drill.id;

    const studios = (await t.get('/api/studios').expect(200)).body.studios as { id: string; name: string }[];
    const studioId = studios.find((s) => s.name === 'Progressions studio')?.id;
    const assigned = await t.post(`/api/studios/${studioId}/assignments`, {
      savedDrillId: id,
      keyOrder: 'fourths',
      targetTempo: 100,
      targetAccuracy: 0.8,
      dueAt: new Date(Date.now() + 7 * 86_400_000).toISOString(),
    });
    expect(assigned.status).toBe(201);
    // the first chord's root in each key of the cycle, in fourths from D
    expect(assigned.body.assignment.keys).toEqual(['D', 'G', 'C', 'F', 'Bb', 'Eb', 'Ab', 'Db', 'F#', 'B', 'E', 'A']);
    expect(assigned.body.assignment.spec.changes).toEqual(SPEC.changes);

    const book = await t.post('/api/books', { title: 'Changes', priceMinor: 0 }).expect(201);
    const added = await t.post(`/api/books/${book.body.book.id}/drills`, { savedDrillId: id });
    expect(added.status).toBe(201);
    const entry = added.body.book.drills[0];
    expect(entry.summary).toMatch(/Dm7 G7 Cmaj7/);
  });

  it('refuses a saved progression drill whose chord lasts a length the pattern cannot fill', async () => {
    const res = await t.post('/api/drills', {
      name: 'Odd',
      spec: { ...SPEC, changes: [{ chord: 'Dm7', beats: 1.5 }] },
    });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.error)).toMatch(/1\.5 beats/);
  });
});
