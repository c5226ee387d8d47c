import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DrillSpec, generateDrill, type PlayedNote } from '../../shared/engine';
import { type Client, createUser, signedIn } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

const SPEC: DrillSpec = {
  pair: ['A', 'G'],
  pattern: 'stack',
  direction: 'up',
  instrument: 'piano',
  tempo: 100,
  range: { low: 57, high: 81 },
};

function takeAt(tempo: number, keep: number) {
  const spec = { ...SPEC, tempo };
  const drill = generateDrill(spec);
  const ms = 60000 / tempo;
  const played: PlayedNote[] = drill.notes
    .slice(0, Math.round(drill.notes.length * keep))
    .map((n) => ({ midi: n.midi, timeMs: n.beat * ms }));
  return { id: randomUUID(), spec, played, options: { tempo, mode: 'timed' }, startedAt: new Date().toISOString() };
}

let p: Client;
beforeAll(async () => {
  p = await signedIn(ctx.app, await createUser(ctx.db, { role: 'player' }));
});

const suggested = async (spec: DrillSpec) =>
  (await p.get(`/api/practice/tempo?spec=${encodeURIComponent(JSON.stringify(spec))}`).expect(200)).body.climb;

describe('tempo climb', () => {
  it('has nothing to suggest before the first take', async () => {
    expect(await suggested(SPEC)).toBeNull();
  });

  it('raises 4 bpm after a clean take and lowers 8 after a messy one, per drill and key', async () => {
    // Rule from the practice issue: clean (>= 95%, |mean offset| within the hit window) +4; under 80% -8.
    await p.post('/api/takes', takeAt(100, 1)).expect(201);
    expect(await suggested(SPEC)).toMatchObject({ tempo: 104, lastTempo: 100, lastVerdict: 'up' });
    await p.post('/api/takes', takeAt(104, 0.5)).expect(201);
    expect(await suggested(SPEC)).toMatchObject({ tempo: 96, lastVerdict: 'down' });
    // The same drill in another key climbs on its own.
    expect(await suggested({ ...SPEC, pair: ['B', 'A'] })).toBeNull();
  });

  it('leaves the tempo alone for ladder steps and stopped takes', async () => {
    const before = await suggested(SPEC);
    await p.post('/api/takes', { ...takeAt(96, 1), measures: [1, 1] }).expect(201);
    await p.post('/api/takes', { ...takeAt(96, 1), stoppedAtMs: 500 }).expect(201);
    expect(await suggested(SPEC)).toEqual(before);
  });

  it('answers a bad spec with a 400 naming the field', async () => {
    const res = await p.get(
      `/api/practice/tempo?spec=${encodeURIComponent(JSON.stringify({ ...SPEC, tempo: 'fast' }))}`,
    );
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain('spec.tempo');
  });
});

describe('player settings', () => {
  it('starts from defaults and keeps what is changed', async () => {
    expect((await p.get('/api/settings').expect(200)).body.settings).toMatchObject({
      instrument: 'piano',
      writtenPitchInput: false,
      latency: {},
    });
    const put = await p.agent
      .put('/api/settings')
      .set('X-CSRF-Token', p.csrf)
      .send({ instrument: 'alto-sax', writtenPitchInput: true, range: { low: 49, high: 81 }, defaultTempo: 92 });
    expect(put.status).toBe(200);
    expect(put.body.settings).toMatchObject({
      instrument: 'alto-sax',
      writtenPitchInput: true,
      range: { low: 49, high: 81 },
      defaultTempo: 92,
      octaveShift: 0,
    });
  });

  it('stores latency per device without losing the others', async () => {
    const set = (device: string, offsetMs: number) =>
      p.agent.put('/api/settings/latency').set('X-CSRF-Token', p.csrf).send({ device, offsetMs });
    await set('Fake Keyboard', 23.44).expect(200);
    const res = await set('Breath Controller', -8).expect(200);
    expect(res.body.settings.latency).toEqual({ 'Fake Keyboard': 23.4, 'Breath Controller': -8 });
  });

  it('names bad fields and needs a session', async () => {
    const bad = await p.agent
      .put('/api/settings')
      .set('X-CSRF-Token', p.csrf)
      .send({ instrument: 'kazoo', octaveShift: 9 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['instrument', 'octaveShift']);
    expect((await request(ctx.app).get('/api/settings')).status).toBe(401);
  });
});
