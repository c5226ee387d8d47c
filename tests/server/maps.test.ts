import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DrillSpec, PlayedNote } from '../../shared/engine';
import { createTake } from '../../server/services/takes/create';
import { type Client, createStudio, createUser, signedIn, type TestUser } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

/*
 * A small history whose cells are counted by hand (tempo 120: a beat is 500 ms).
 *
 * F/Eb weave, range F4..F5, one measure of triplets:
 *   idx   0    1    2    3    4    5    6    7    8
 *   midi  65   69   72   75   70   67   69   72   77
 *   pos   1    4/3  5/3  2    7/3  8/3  3    10/3 11/3
 * B/A four-three, range B3..D5, one measure of eighths:
 *   idx   0    1    2    3    4    5    6
 *   midi  59   63   66   71   69   64   61
 *   pos   1    1.5  2    2.5  3    3.5  4
 *
 * T1 (2026-03-02) F/Eb weave: idx 1 and 4 not played -> 9 notes, 2 errors.
 * T2 (2026-03-03) B/A four-three: idx 0 played as 60 (wrong), idx 6 100 ms early -> 7 notes, 2 errors.
 * T3 (2026-03-10) F/Eb weave stopped at 1000 ms: idx 0-6 scored (7 notes), idx 2 not played
 *   -> 7 notes, 1 error; idx 7 and 8 come after the stop and count nowhere.
 */
const ctx = createTestApp();
afterAll(() => ctx.close());

const WEAVE: DrillSpec = {
  pair: ['F', 'Eb'],
  pattern: 'weave',
  direction: 'up',
  range: { low: 65, high: 77 },
  tempo: 120,
  instrument: 'piano',
};
const FOUR_THREE: DrillSpec = {
  pair: ['B', 'A'],
  pattern: 'four-three',
  direction: 'up',
  range: { low: 59, high: 74 },
  tempo: 120,
  instrument: 'piano',
};
const WEAVE_NOTES = [65, 69, 72, 75, 70, 67, 69, 72, 77].map((midi, i) => ({ midi, timeMs: (i * 500) / 3 }));
const FOUR_THREE_NOTES = [59, 63, 66, 71, 69, 64, 61].map((midi, i) => ({ midi, timeMs: i * 250 }));
const options = { tempo: 120, mode: 'timed' as const };

let player: TestUser;
let other: TestUser;
let teacher: TestUser;
let outsider: TestUser;
let p: Client;

async function take(playerId: string, spec: DrillSpec, played: PlayedNote[], day: string, stoppedAtMs?: number) {
  const { take: row } = await createTake(ctx.db, {
    playerId,
    id: randomUUID(),
    spec,
    played,
    options,
    startedAt: new Date(`${day}T10:00:00Z`),
    stoppedAtMs,
  });
  return row;
}

beforeAll(async () => {
  player = await createUser(ctx.db, { role: 'player' });
  other = await createUser(ctx.db, { role: 'player' });
  teacher = await createUser(ctx.db, { role: 'teacher' });
  outsider = await createUser(ctx.db, { role: 'teacher' });
  await createStudio(ctx.db, teacher.id, [player.id]);
  await take(
    player.id,
    WEAVE,
    WEAVE_NOTES.filter((_, i) => i !== 1 && i !== 4),
    '2026-03-02',
  );
  await take(
    player.id,
    FOUR_THREE,
    FOUR_THREE_NOTES.map((n, i) => (i === 0 ? { ...n, midi: 60 } : i === 6 ? { ...n, timeMs: n.timeMs - 100 } : n)),
    '2026-03-03',
  );
  await take(
    player.id,
    WEAVE,
    WEAVE_NOTES.filter((_, i) => i !== 2),
    '2026-03-10',
    1000,
  );
  // Someone else's take, which must never show in the player's maps.
  await take(other.id, WEAVE, [], '2026-03-02');
  p = await signedIn(ctx.app, player);
});

const cell = (notes: number, errors: number) => ({ notes, errors, rate: errors / notes });

describe('GET /api/maps/keys', () => {
  it('counts expected notes and non-hits per key and pattern', async () => {
    const res = await p.get('/api/maps/keys').expect(200);
    expect(res.body.cells).toEqual([
      { key: 'B', pattern: 'four-three', ...cell(7, 2) },
      { key: 'F', pattern: 'weave', ...cell(16, 3) },
    ]);
  });

  it('filters by pattern, pair, instrument and days', async () => {
    expect((await p.get('/api/maps/keys?pattern=four-three').expect(200)).body.cells).toEqual([
      { key: 'B', pattern: 'four-three', ...cell(7, 2) },
    ]);
    expect((await p.get('/api/maps/keys?pair=F/Eb').expect(200)).body.cells).toEqual([
      { key: 'F', pattern: 'weave', ...cell(16, 3) },
    ]);
    expect((await p.get('/api/maps/keys?from=2026-03-05').expect(200)).body.cells).toEqual([
      { key: 'F', pattern: 'weave', ...cell(7, 1) },
    ]);
    expect((await p.get('/api/maps/keys?from=2026-03-02&to=2026-03-02').expect(200)).body.cells).toEqual([
      { key: 'F', pattern: 'weave', ...cell(9, 2) },
    ]);
    expect((await p.get('/api/maps/keys?instrument=flute').expect(200)).body.cells).toEqual([]);
  });

  it('says which filter is wrong', async () => {
    const res = await p.get('/api/maps/keys?from=March').expect(400);
    expect(res.body.error.fields).toHaveProperty('from');
  });
});

describe('GET /api/maps/range', () => {
  it('counts per concert pitch', async () => {
    const res = await p.get('/api/maps/range').expect(200);
    expect(res.body.cells).toEqual([
      { midi: 59, ...cell(1, 1) },
      { midi: 61, ...cell(1, 1) },
      { midi: 63, ...cell(1, 0) },
      { midi: 64, ...cell(1, 0) },
      { midi: 65, ...cell(2, 0) },
      { midi: 66, ...cell(1, 0) },
      { midi: 67, ...cell(2, 0) },
      { midi: 69, ...cell(5, 1) },
      { midi: 70, ...cell(2, 1) },
      { midi: 71, ...cell(1, 0) },
      { midi: 72, ...cell(3, 1) },
      { midi: 75, ...cell(2, 0) },
      { midi: 77, ...cell(1, 0) },
    ]);
  });
});

describe('GET /api/maps/beats', () => {
  it('counts per position in the bar, to a twelfth of a beat', async () => {
    const res = await p.get('/api/maps/beats').expect(200);
    const t = (x: number) => Math.round(x * 12) / 12;
    expect(res.body.cells).toEqual([
      { meter: '4/4', position: 1, ...cell(3, 1) },
      { meter: '4/4', position: t(4 / 3), ...cell(2, 1) },
      { meter: '4/4', position: 1.5, ...cell(1, 0) },
      { meter: '4/4', position: t(5 / 3), ...cell(2, 1) },
      { meter: '4/4', position: 2, ...cell(3, 0) },
      { meter: '4/4', position: t(7 / 3), ...cell(2, 1) },
      { meter: '4/4', position: 2.5, ...cell(1, 0) },
      { meter: '4/4', position: t(8 / 3), ...cell(2, 0) },
      { meter: '4/4', position: 3, ...cell(3, 0) },
      { meter: '4/4', position: t(10 / 3), ...cell(1, 0) },
      { meter: '4/4', position: 3.5, ...cell(1, 0) },
      { meter: '4/4', position: t(11 / 3), ...cell(1, 0) },
      { meter: '4/4', position: 4, ...cell(1, 1) },
    ]);
  });
});

describe('deleting a take', () => {
  it('takes its notes out of every map', async () => {
    const extra = await take(player.id, FOUR_THREE, [], '2026-03-11');
    expect((await p.get('/api/maps/keys?pattern=four-three').expect(200)).body.cells).toEqual([
      { key: 'B', pattern: 'four-three', ...cell(14, 9) },
    ]);
    await p.agent.delete(`/api/takes/${extra.id}`).set('X-CSRF-Token', p.csrf).expect(204);
    expect((await p.get('/api/maps/keys?pattern=four-three').expect(200)).body.cells).toEqual([
      { key: 'B', pattern: 'four-three', ...cell(7, 2) },
    ]);
    expect((await p.get('/api/maps/range?from=2026-03-11').expect(200)).body.cells).toEqual([]);
    expect((await p.get('/api/maps/beats?from=2026-03-11').expect(200)).body.cells).toEqual([]);
  });
});

describe('who may read a map', () => {
  it('lets a teacher read a player of their studio', async () => {
    const t = await signedIn(ctx.app, teacher);
    const res = await t.get(`/api/maps/keys?player=${player.id}`).expect(200);
    expect(res.body.cells).toHaveLength(2);
    await t.get(`/api/maps/range?player=${other.id}`).expect(404);
  });

  it("answers 404 for anyone else's player", async () => {
    const o = await signedIn(ctx.app, other);
    for (const map of ['keys', 'range', 'beats', 'timeline', 'calendar', 'next']) {
      await o.get(`/api/maps/${map}?player=${player.id}`).expect(404);
    }
    const x = await signedIn(ctx.app, outsider);
    await x.get(`/api/maps/beats?player=${player.id}`).expect(404);
    // The other player's own map holds only their own take.
    expect((await o.get('/api/maps/keys').expect(200)).body.cells).toEqual([
      { key: 'F', pattern: 'weave', ...cell(9, 9) },
    ]);
  });

  it('is for signed-in users only', async () => {
    const { default: request } = await import('supertest');
    await request(ctx.app).get('/api/maps/keys').expect(401);
  });
});

describe('charts', () => {
  it('gives accuracy and tempo per day and key, and practice minutes per day in the asked time zone', async () => {
    const tl = await p.get('/api/maps/timeline?tz=UTC').expect(200);
    expect(tl.body.points.map((x: { day: string; key: string }) => `${x.day} ${x.key}`)).toEqual([
      '2026-03-02 F',
      '2026-03-03 B',
      '2026-03-10 F',
    ]);
    expect(tl.body.points[0].accuracy).toBeCloseTo(7 / 9);
    // 10:00 UTC on the 2nd is still the 2nd in Honolulu (UTC-10 -> 00:00); in Kiritimati (UTC+14) the 3rd.
    const cal = await p.get('/api/maps/calendar?tz=Pacific/Kiritimati').expect(200);
    expect(cal.body.days.map((d: { day: string }) => d.day)).toEqual(['2026-03-03', '2026-03-04', '2026-03-11']);
    expect(cal.body.streak.longest).toBe(2);
    // A weave take lasts 1.5 s (three beats at 120): 0.025 minutes, shown to a tenth.
    expect(cal.body.days[0]).toMatchObject({ minutes: 0, takes: 1 });
    await p.get('/api/maps/calendar?tz=Mars/Olympus').expect(400);
  });
});

const putSettings = (c: Client, body: object) => c.agent.put('/api/settings').set('X-CSRF-Token', c.csrf).send(body);

describe('practice log goal and week over week', () => {
  it('keeps the weekly minutes goal the player sets and shows it with the practice log', async () => {
    const fresh = await createUser(ctx.db, { role: 'player' });
    const f = await signedIn(ctx.app, fresh);
    expect((await f.get('/api/maps/calendar').expect(200)).body.weeklyMinutesGoal).toBeNull();
    const put = await putSettings(f, { weeklyMinutesGoal: 150 }).expect(200);
    expect(put.body.settings.weeklyMinutesGoal).toBe(150);
    expect((await f.get('/api/maps/calendar').expect(200)).body.weeklyMinutesGoal).toBe(150);
    const bad = await putSettings(f, { weeklyMinutesGoal: 3 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.weeklyMinutesGoal).toBeDefined();
    await putSettings(f, { weeklyMinutesGoal: null }).expect(200);
    expect((await f.get('/api/maps/calendar').expect(200)).body.weeklyMinutesGoal).toBeNull();
  });

  it('gives each drill six weeks, oldest first, Mondays in the asked time zone, empty weeks as null', async () => {
    const fresh = await createUser(ctx.db, { role: 'player' });
    const day = (daysAgo: number) => new Date(Date.now() - daysAgo * 86_400_000).toISOString().slice(0, 10);
    await take(fresh.id, WEAVE, WEAVE_NOTES, day(0));
    await take(fresh.id, { ...WEAVE, tempo: 100 }, WEAVE_NOTES, day(0));
    await take(fresh.id, WEAVE, [], day(14));
    await take(fresh.id, FOUR_THREE, FOUR_THREE_NOTES, day(60));
    const f = await signedIn(ctx.app, fresh);
    const res = await f.get('/api/maps/weekly?tz=UTC').expect(200);
    expect(res.body.weeks).toHaveLength(6);
    for (const w of res.body.weeks) expect(new Date(`${w}T00:00:00Z`).getUTCDay()).toBe(1);
    // the four-three take is older than six weeks
    expect(res.body.drills.map((d: { pattern: string; pair: string }) => `${d.pattern} ${d.pair}`)).toEqual([
      'weave F/Eb',
    ]);
    const weeks = res.body.drills[0].weeks as { takes: number; accuracy: number | null; tempo: number | null }[];
    expect(weeks.at(-1)).toMatchObject({ takes: 2, tempo: 120 });
    expect(weeks.filter((w) => w.takes > 0)).toHaveLength(day(14) >= res.body.weeks[0] ? 2 : 1);
    expect(weeks.find((w) => w.takes === 0)?.accuracy).toBeNull();
    const t = await signedIn(ctx.app, teacher);
    await t.get(`/api/maps/weekly?player=${fresh.id}`).expect(404);
    await f.get('/api/maps/weekly?tz=Nowhere/Else').expect(400);
  });
});
