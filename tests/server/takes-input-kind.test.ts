import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { parseMidi } from 'midi-file';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { detectNotes } from '../../shared/audio';
import { type DrillSpec, generateDrill } from '../../shared/engine';
import { readWav } from '../../scripts/audio/horn-synth';
import { type Client, createUser, signedIn, type TestUser } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

// The SoX recording (fixtures/audio/sox-line.*) heard by the detector, its first note on the
// first downbeat, as the practice page would send a take played through the microphone.
const SPEC: DrillSpec = {
  pair: ['C', 'D'],
  pattern: 'stack',
  direction: 'up',
  instrument: 'piano',
  tempo: 120,
  range: { low: 48, high: 84 },
};
const { samples, sampleRate } = readWav(readFileSync(new URL('../../fixtures/audio/sox-line.wav', import.meta.url)));
const heard = detectNotes(samples, sampleRate);
const played = heard.map((n) => ({ ...n, timeMs: n.timeMs - heard[0].timeMs }));

const body = (overrides: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  spec: SPEC,
  played,
  options: { tempo: 120, mode: 'free' },
  startedAt: new Date().toISOString(),
  ...overrides,
});

let player: TestUser;
let p: Client;

beforeAll(async () => {
  player = await createUser(ctx.db, { role: 'player' });
  p = await signedIn(ctx.app, player);
});

describe('what a take was played on', () => {
  it('stores a microphone take, returns its input kind, and exports it to MIDI like any take', async () => {
    const res = await p.post('/api/takes', body({ inputKind: 'microphone' }));
    expect(res.status).toBe(201);
    expect(res.body.take.inputKind).toBe('microphone');
    expect(res.body.take.played).toEqual(played);
    const got = await p.get(`/api/takes/${res.body.take.id}`);
    expect(got.body.take.inputKind).toBe('microphone');
    const row = await ctx.pool.query('SELECT input_kind FROM takes WHERE id = $1', [res.body.take.id]);
    expect(row.rows[0].input_kind).toBe('microphone');

    const midi = await p.agent
      .get(`/api/takes/${res.body.take.id}/midi`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(midi.status).toBe(200);
    // Standard MIDI Files 1.0, read by an independent parser (midi-file): the Take track holds
    // every note heard, at the velocity the detector gave it.
    const file = parseMidi(midi.body as Buffer);
    const names = file.tracks
      .map((t) => t.find((e) => e.type === 'trackName'))
      .map((e) => (e && 'text' in e ? e.text : ''));
    const ons = file.tracks[names.indexOf('Take')].filter(
      (e) => e.type === 'noteOn' && 'velocity' in e && e.velocity > 0,
    );
    expect(ons.map((e) => ('noteNumber' in e ? e.noteNumber : -1))).toEqual(played.map((n) => n.midi));
    expect(ons.map((e) => ('velocity' in e ? e.velocity : -1))).toEqual(played.map((n) => n.velocity));
  });

  it('keeps takes sent without one (null), and refuses a kind it does not know, naming the field', async () => {
    const none = await p.post('/api/takes', body());
    expect(none.status).toBe(201);
    expect(none.body.take.inputKind).toBeNull();
    const bad = await p.post('/api/takes', body({ inputKind: 'theremin' }));
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.inputKind.join(' ')).toMatch(/midi, keyboard, microphone or file/);
  });

  it('marks an imported MIDI file as such', async () => {
    const drill = generateDrill(SPEC);
    const { drillToMidi } = await import('../../shared/engine');
    const res = await p.agent
      .post('/api/takes/import')
      .set('X-CSRF-Token', p.csrf)
      .attach('file', Buffer.from(drillToMidi(drill)), 'drill.mid')
      .field('spec', JSON.stringify(SPEC));
    expect(res.status).toBe(201);
    expect(res.body.take.inputKind).toBe('file');
  });
});
