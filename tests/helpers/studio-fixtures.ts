import { randomUUID } from 'node:crypto';
import { type DrillSpec, generateDrill, inAllKeys, type PlayedNote } from '../../shared/engine';
import type { Db } from '../../server/db/client';
import { savedDrills } from '../../server/db/schema';
import type { Client } from './factories';

/** A short drill, quick to score: D/C four-three, one octave and a bit, at 100 bpm. */
export const STUDIO_SPEC: DrillSpec = {
  pair: ['D', 'C'],
  pattern: 'four-three',
  direction: 'up',
  instrument: 'piano',
  tempo: 100,
  range: { low: 60, high: 79 },
};

export async function createSavedDrill(
  db: Db,
  ownerId: string,
  spec: DrillSpec = STUDIO_SPEC,
  name = 'Four-three on D/C',
) {
  const [row] = await db
    .insert(savedDrills)
    .values({ ownerId, name, spec: spec as never, keyOrder: null })
    .returning();
  return row;
}

/**
 * A take body for POST /api/takes: every note on time, or the first `miss` notes left out
 * (so the accuracy falls below 1).
 */
export function takeBody(spec: DrillSpec, opts: { assignmentId?: string; miss?: number } = {}) {
  const drill = generateDrill(spec);
  const tempo = drill.spec.tempo;
  const played: PlayedNote[] = drill.notes
    .slice(opts.miss ?? 0)
    .map((n) => ({ midi: n.midi, timeMs: (n.beat * 60000) / tempo, velocity: 80 }));
  return {
    id: randomUUID(),
    spec,
    played,
    options: { tempo, mode: 'timed' as const },
    startedAt: new Date().toISOString(),
    ...(opts.assignmentId ? { assignmentId: opts.assignmentId } : {}),
  };
}

/** The spec of each key of a key cycle, in its order. */
export function cycleSpecs(spec: DrillSpec, order: 'chromatic' | 'fourths' | 'fifths'): DrillSpec[] {
  return inAllKeys(spec, order).map((d) => d.spec as DrillSpec);
}

export async function postTake(player: Client, spec: DrillSpec, opts: { assignmentId?: string; miss?: number } = {}) {
  const res = await player.post('/api/takes', takeBody(spec, opts));
  if (res.status !== 201) throw new Error(`take not stored: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.take as { id: string; accuracy: number; key: string; tempo: number };
}

export function inDays(days: number): string {
  return new Date(Date.now() + days * 86_400_000).toISOString();
}
