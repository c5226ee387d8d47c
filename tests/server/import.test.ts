import { randomBytes } from 'node:crypto';
import MidiWriter from 'midi-writer-js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DrillSpec } from '../../shared/engine';
import { type Client, createUser, signedIn, type TestUser } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

// B/A four-three in B3..D5 at 120: B3 D#4 F#4 B4 | A4 E4 C#4, eighth notes.
const SPEC: DrillSpec = {
  pair: ['B', 'A'],
  pattern: 'four-three',
  direction: 'up',
  range: { low: 59, high: 74 },
  tempo: 120,
  instrument: 'piano',
};
const PITCHES = [59, 63, 66, 71, 69, 64, 61];

/** The drill as another program would write it (midi-writer-js), after a rest of `restTicks` (128 a beat). */
function writtenElsewhere(restTicks = 0, pitches = PITCHES): Buffer {
  const track = new MidiWriter.Track();
  track.setTempo(120);
  track.addTrackName('Piano');
  pitches.forEach((pitch, i) => {
    track.addEvent(
      new MidiWriter.NoteEvent({ pitch: [pitch], duration: '8', startTick: restTicks + i * 64, velocity: 80 }),
    );
  });
  return Buffer.from(new MidiWriter.Writer(track).buildFile());
}

let player: TestUser;
let p: Client;

beforeAll(async () => {
  player = await createUser(ctx.db, { role: 'player' });
  p = await signedIn(ctx.app, player);
});

const upload = (file: Buffer, name: string, fields: Record<string, string> = {}) => {
  const req = p.agent
    .post('/api/takes/import')
    .set('X-CSRF-Token', p.csrf)
    .attach('file', file, name)
    .field('spec', JSON.stringify(SPEC));
  for (const [k, v] of Object.entries(fields)) req.field(k, v);
  return req;
};

const stored = async () =>
  (await ctx.pool.query('SELECT count(*)::int AS n FROM takes WHERE player_id = $1', [player.id])).rows[0].n as number;

describe('POST /api/takes/import', () => {
  it('scores a file written by another program, its first note on the first downbeat', async () => {
    const res = await upload(writtenElsewhere(), 'from-elsewhere.mid');
    expect(res.status).toBe(201);
    expect(res.body.take).toMatchObject({ playerId: player.id, key: 'B', pattern: 'four-three', accuracy: 1 });
    expect(res.body.take.played.map((n: { midi: number }) => n.midi)).toEqual(PITCHES);
    expect(res.body.take.played[0].timeMs).toBe(0);
    const notes = await ctx.pool.query('SELECT count(*)::int AS n FROM take_notes WHERE take_id = $1', [
      res.body.take.id,
    ]);
    expect(notes.rows[0].n).toBe(7);
  });

  it('places the first downbeat where offsetMs says', async () => {
    // A beat of rest (500 ms) before the first note; the downbeat is at 500.
    const onTime = await upload(writtenElsewhere(128), 'rest-first.mid', { offsetMs: '500' }).expect(201);
    expect(onTime.body.take.score.accuracy).toBe(1);
    // Told the downbeat is at 0, every note comes a beat late: nothing is a hit.
    const late = await upload(writtenElsewhere(128), 'rest-first.mid', { offsetMs: '0' }).expect(201);
    expect(late.body.take.score.accuracy).toBe(0);
  });

  it('judges a file by its content, not its name', async () => {
    const res = await upload(writtenElsewhere(), 'take.txt');
    expect(res.status).toBe(201);
  });

  it('refuses broken files with a message that says which, storing nothing', async () => {
    const before = await stored();
    let bytes = randomBytes(512);
    if (bytes.subarray(0, 4).toString('latin1') === 'MThd') bytes = Buffer.concat([Buffer.from('xxxx'), bytes]);
    const random = await upload(bytes, 'noise.mid').expect(400);
    expect(random.body.error.message).toMatch(/not a Standard MIDI File/);

    const truncated = await upload(writtenElsewhere().subarray(0, 10), 'cut.mid').expect(400);
    expect(truncated.body.error.message).toMatch(/cut short/);
    const cutTrack = await upload(writtenElsewhere().subarray(0, 40), 'cut-track.mid').expect(400);
    expect(cutTrack.body.error.message).toMatch(/cut short/);

    const text = await upload(
      Buffer.from('These are my notes for Tuesday: B D# F# B, then A E C#.\n'),
      'notes.mid',
    ).expect(400);
    expect(text.body.error.message).toMatch(/not a Standard MIDI File/);

    const silent = new MidiWriter.Track();
    silent.setTempo(120);
    const empty = await upload(Buffer.from(new MidiWriter.Writer(silent).buildFile()), 'silent.mid').expect(400);
    expect(empty.body.error.message).toMatch(/no notes/);

    const big = await upload(Buffer.concat([writtenElsewhere(), Buffer.alloc(2 * 1024 * 1024)]), 'big.mid').expect(413);
    expect(big.body.error.message).toMatch(/1 MB/);

    expect(await stored()).toBe(before);
  });

  it('refuses a file of more than 20,000 notes before reading it, storing nothing', async () => {
    const before = await stored();
    // 20,001 eighth notes, 4,000 a track (midi-writer-js overflows the stack writing one long track)
    const tracks = [];
    for (let first = 0; first < 20_001; first += 4000) {
      const track = new MidiWriter.Track();
      for (let i = first; i < Math.min(20_001, first + 4000); i++) {
        track.addEvent(new MidiWriter.NoteEvent({ pitch: [PITCHES[i % PITCHES.length]], duration: '8', velocity: 80 }));
      }
      tracks.push(track);
    }
    const crowded = Buffer.from(new MidiWriter.Writer(tracks).buildFile());
    const started = performance.now();
    const res = await upload(crowded, 'crowded.mid').expect(400);
    expect(performance.now() - started).toBeLessThan(2000);
    expect(res.body.error.message).toBe('The file holds more than 20,000 notes; a take holds at most 20,000.');
    expect(res.body.error.fields.file).toEqual([res.body.error.message]);
    expect(await stored()).toBe(before);
  });

  it('asks for the file and a valid spec', async () => {
    const noFile = await p.agent
      .post('/api/takes/import')
      .set('X-CSRF-Token', p.csrf)
      .field('spec', JSON.stringify(SPEC))
      .expect(400);
    expect(noFile.body.error.fields).toHaveProperty('file');
    const badSpec = await p.agent
      .post('/api/takes/import')
      .set('X-CSRF-Token', p.csrf)
      .attach('file', writtenElsewhere(), 'a.mid')
      .field('spec', '{"pair":["B"]}')
      .expect(400);
    expect(Object.keys(badSpec.body.error.fields).some((k) => k.startsWith('spec'))).toBe(true);
  });

  it('is for players, with the CSRF token', async () => {
    await p.agent
      .post('/api/takes/import')
      .attach('file', writtenElsewhere(), 'a.mid')
      .field('spec', JSON.stringify(SPEC))
      .expect(403);
    const teacher = await createUser(ctx.db, { role: 'teacher' });
    const t = await signedIn(ctx.app, teacher);
    await t.agent
      .post('/api/takes/import')
      .set('X-CSRF-Token', t.csrf)
      .attach('file', writtenElsewhere(), 'a.mid')
      .field('spec', JSON.stringify(SPEC))
      .expect(403);
  });
});
