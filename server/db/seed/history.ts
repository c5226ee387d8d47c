import { eq } from 'drizzle-orm';
import {
  type Drill,
  type DrillSpec,
  type InstrumentId,
  inAllKeys,
  type PlayedNote,
  type ScoreOptions,
} from '../../../shared/engine';
import { createTake } from '../../services/takes/create';
import type { Db } from '../client';
import { takes, users } from '../schema';

/** A small seeded PRNG (mulberry32): the same history every time. */
export function prng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A UUID-shaped id from the PRNG, so reruns on an empty database make the same takes. */
export function prngUuid(rand: () => number): string {
  const hex = Array.from({ length: 32 }, () => Math.floor(rand() * 16).toString(16));
  hex[12] = '4';
  hex[16] = ((Number.parseInt(hex[16], 16) & 0x3) | 0x8).toString(16);
  const s = hex.join('');
  return `${s.slice(0, 8)}-${s.slice(8, 12)}-${s.slice(12, 16)}-${s.slice(16, 20)}-${s.slice(20)}`;
}

/** How one demo player plays a drill note: the weaknesses of docs/demo-scenario.md. */
interface Habits {
  instrument: InstrumentId;
  range: { low: number; high: number };
  drills: Array<{ spec: Omit<DrillSpec, 'instrument' | 'range'>; order: 'chromatic' | 'fourths' | 'fifths' }>;
  /** evening hour (UTC) the sessions start, and how many takes a session holds */
  hour: number;
  takesPerSession: [number, number];
  practiceChance: number;
  inputTransposition?: number;
  /** chance of a missed note in this key */
  missIn(key: string): number;
  /** how the note comes out: shifted in time or pitch, or as played */
  shape(note: Drill['notes'][number], drill: Drill, rand: () => number): { dMs: number; dMidi: number };
}

const ASSIGNED = [
  { spec: { pair: ['D', 'C'], pattern: 'four-three', direction: 'up', tempo: 100, chord: 'D7' }, order: 'chromatic' },
  {
    spec: { pair: ['Bbm', 'Ab'], pattern: 'scale-steps', direction: 'up', tempo: 90, chord: 'Bbm7' },
    order: 'fourths',
  },
  { spec: { pair: ['G', 'Db'], pattern: 'weave', direction: 'up-down', tempo: 80, chord: 'G7' }, order: 'fifths' },
] as const satisfies Habits['drills'];

const steady = () => ({ dMs: 0, dMidi: 0 });

export const DEMO_HABITS: Record<string, Habits> = {
  // Strong in flat keys, weak in B, E and F#; late, short sessions.
  'player@sixfold.test': {
    instrument: 'piano',
    range: { low: 48, high: 79 },
    drills: [...ASSIGNED],
    hour: 22,
    takesPerSession: [2, 4],
    practiceChance: 0.75,
    missIn: (key) =>
      ['B', 'E', 'F#'].includes(key) ? 0.16 : ['Db', 'Eb', 'Ab', 'Bb', 'F'].includes(key) ? 0.015 : 0.04,
    shape: steady,
  },
  // Plays written pitch on a keyboard; rushes groupings that cross the bar line.
  'alto@sixfold.test': {
    instrument: 'alto-sax',
    range: { low: 52, high: 77 },
    drills: [...ASSIGNED],
    hour: 18,
    takesPerSession: [3, 6],
    practiceChance: 0.7,
    inputTransposition: -9,
    missIn: () => 0.03,
    shape: (note, drill, rand) => {
      const last = drill.spec.meter[0] + 0.5;
      const crossing = note.beatInMeasure >= last - 1e-6 || (note.measure > 1 && note.beatInMeasure < 1.01);
      return { dMs: crossing && rand() < 0.7 ? -(95 + rand() * 45) : 0, dMidi: 0 };
    },
  },
  // Smooth legato; octave slips at the top of the range.
  'wind@sixfold.test': {
    instrument: 'wind-controller',
    range: { low: 55, high: 84 },
    drills: [...ASSIGNED],
    hour: 7,
    takesPerSession: [3, 5],
    practiceChance: 0.65,
    missIn: () => 0.025,
    shape: (note, drill, rand) => ({
      dMs: 0,
      dMidi: note.midi >= (drill.spec.range?.high ?? 127) - 5 && rand() < 0.35 ? -12 : 0,
    }),
  },
};

/** One take of a drill as the player would play it. */
function perform(drill: Drill, habits: Habits, key: string, rand: () => number): PlayedNote[] {
  const ms = 60000 / drill.spec.tempo;
  const played: PlayedNote[] = [];
  for (const note of drill.notes) {
    if (rand() < habits.missIn(key)) continue;
    const { dMs, dMidi } = habits.shape(note, drill, rand);
    const jitter = (rand() - 0.5) * 30;
    played.push({
      midi: note.midi + dMidi - (habits.inputTransposition ?? 0),
      timeMs: Math.round(note.beat * ms + jitter + dMs),
      velocity: 64 + Math.floor(rand() * 40),
    });
  }
  return played;
}

/**
 * About six weeks of takes for each demo player, stored through createTake (so the maps add up
 * the same per-note results as any take). A player who already has takes is left alone.
 */
export async function seedDemoHistory(db: Db, now = new Date(), days = 42): Promise<number> {
  let made = 0;
  for (const [email, habits] of Object.entries(DEMO_HABITS)) {
    const [user] = await db.select({ id: users.id }).from(users).where(eq(users.email, email)).limit(1);
    if (!user) continue;
    const [any] = await db.select({ id: takes.id }).from(takes).where(eq(takes.playerId, user.id)).limit(1);
    if (any) continue;
    const rand = prng([...email].reduce((h, c) => Math.imul(h ^ c.charCodeAt(0), 16777619), 2166136261));
    const cycles = habits.drills.map((d) => ({
      ...d,
      drills: inAllKeys(
        {
          ...d.spec,
          pair: d.spec.pair && [d.spec.pair[0], d.spec.pair[1]],
          instrument: habits.instrument,
          range: habits.range,
        },
        d.order,
      ),
    }));
    const options: ScoreOptions = {
      tempo: 100,
      mode: 'timed',
      ...(habits.inputTransposition ? { inputTransposition: habits.inputTransposition } : {}),
    };
    const start = new Date(now);
    start.setUTCHours(habits.hour, 0, 0, 0);
    let step = 0;
    for (let d = days; d >= 1; d--) {
      if (rand() > habits.practiceChance) continue;
      const cycle = cycles[Math.floor(rand() * cycles.length)];
      const [lo, hi] = habits.takesPerSession;
      const count = lo + Math.floor(rand() * (hi - lo + 1));
      let at = start.getTime() - d * 86_400_000 + Math.floor(rand() * 40) * 60_000;
      for (let i = 0; i < count; i++) {
        const drill = cycle.drills[step++ % 12];
        const key = drill.spec.pair[0].replace(/m$/, '');
        await createTake(db, {
          playerId: user.id,
          id: prngUuid(rand),
          spec: drill.spec,
          played: perform(drill, habits, key, rand),
          options: { ...options, tempo: drill.spec.tempo },
          startedAt: new Date(at),
        });
        made++;
        at += (drill.notes.at(-1)!.beat * 60_000) / drill.spec.tempo + 45_000;
      }
    }
  }
  return made;
}
