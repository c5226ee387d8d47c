import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DrillSpec, generateDrill } from '../../shared/engine';
import { createTake } from '../../server/services/takes/create';
import { createUser, signedIn, type TestUser } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

/*
 * The fixture history, by (key, pattern), with days counted back from today:
 *   Bb four-three  6 takes x 7 notes, 1 missed each, 20 days ago: rate 6/42,  score 1/7 x (1 + 20/30) = 0.238
 *   F  weave       5 takes x 9 notes, 2 missed each, today:       rate 10/45, score 0.222
 *   B  four-three  6 takes x 7 notes, 1 missed each, 10 days ago: rate 6/42,  score 1/7 x (1 + 10/30) = 0.190
 *   Eb weave       3 takes x 9 notes, 4 missed each, 2 days ago:  27 notes, under 40: left out
 *   D  four-three  6 takes, clean, yesterday:                     no errors: not weak
 *   C  weave       5 takes, nothing played, 40 days ago:          outside the 30 days (but practised)
 * Top three: Bb four-three, F weave, B four-three. Then the keys never played in the latest
 * pattern (weave, today): Db, D, E.
 */
const ctx = createTestApp();
afterAll(() => ctx.close());

let player: TestUser;

const spec = (a: string, b: string, pattern: 'weave' | 'four-three'): DrillSpec => ({
  pair: [a, b],
  pattern,
  direction: 'up',
  tempo: 120,
  instrument: 'piano',
});

async function takes(s: DrillSpec, count: number, missing: number, daysAgo: number, playNothing = false) {
  const drill = generateDrill(s);
  const notes = drill.notes.slice(0, pattern(s) === 'weave' ? 9 : 7);
  const stop = notes.at(-1)!.beat * 500;
  const played = playNothing ? [] : notes.slice(missing).map((n) => ({ midi: n.midi, timeMs: n.beat * 500 }));
  const at = Date.now() - daysAgo * 86_400_000;
  for (let i = 0; i < count; i++) {
    await createTake(ctx.db, {
      playerId: player.id,
      id: randomUUID(),
      spec: s,
      played,
      options: { tempo: 120, mode: 'timed' },
      startedAt: new Date(at - i * 1000),
      stoppedAtMs: stop,
    });
  }
}
const pattern = (s: DrillSpec) => s.pattern as string;

beforeAll(async () => {
  player = await createUser(ctx.db, { role: 'player' });
  await takes(spec('C', 'Bb', 'weave'), 5, 0, 40, true);
  await takes(spec('Bb', 'Ab', 'four-three'), 6, 1, 20);
  await takes(spec('B', 'A', 'four-three'), 6, 1, 10);
  await takes(spec('Eb', 'Db', 'weave'), 3, 4, 2);
  await takes(spec('D', 'C', 'four-three'), 6, 0, 1);
  await takes(spec('F', 'Eb', 'weave'), 5, 2, 0);
});

describe('GET /api/maps/next', () => {
  it('puts the weakest cells first, weighted by days since, then keys never played', async () => {
    const p = await signedIn(ctx.app, player);
    const { items } = (await p.get('/api/maps/next').expect(200)).body;
    expect(
      items.map((i: { key: string; pattern: string; reason: string }) => `${i.key} ${i.pattern} ${i.reason}`),
    ).toEqual([
      'Bb four-three weak',
      'F weave weak',
      'B four-three weak',
      'Db weave unpractised',
      'D weave unpractised',
      'E weave unpractised',
    ]);
    expect(items[0]).toMatchObject({ notes: 42, errors: 6, daysSince: 20 });
    expect(items[0].score).toBeCloseTo((6 / 42) * (1 + 20 / 30));
    expect(items[1]).toMatchObject({ notes: 45, errors: 10, daysSince: 0 });
    // Each comes with a drill one click from a take: the player's own pair, moved to the key.
    expect(items[0].spec).toMatchObject({ pair: ['Bb', 'Ab'], pattern: 'four-three' });
    // the moved pair is spelled as one unit (Db/Cb would make Cb a root), so Eb/Db a whole step down reads C#/B
    expect(items[3].spec).toMatchObject({ pair: ['C#', 'B'], pattern: 'weave' });
  });

  it('has nothing to say to a player with no takes', async () => {
    const fresh = await createUser(ctx.db, { role: 'player' });
    const p = await signedIn(ctx.app, fresh);
    expect((await p.get('/api/maps/next').expect(200)).body.items).toEqual([]);
  });
});
