import { EngineError } from '../errors';
import type { DrillNote, ScoreOptions } from '../types';

/**
 * Free mode's band, in notes: how far apart two positions may be and still be paired.
 *
 * @example
 * FREE_BAND // 64: the 70th note played can stand for expected notes 6 to 134, no further
 */
export const FREE_BAND = 64;

/**
 * Where a drill note falls in milliseconds from the first downbeat. With swing, a note on the
 * second eighth of a beat (beat x.5) moves to floor(beat) + swing; every other note stays.
 *
 * @example
 * expectedTimeMs(1.5, 120)       // 750
 * expectedTimeMs(1.5, 120, 0.7)  // 850: swung, the "and" lands at 70 % of the beat
 */
export function expectedTimeMs(beat: number, tempo: number, swing = 0.5): number {
  const whole = Math.floor(beat);
  const onTheAnd = Math.abs(beat - whole - 0.5) < 1e-9;
  const placed = onTheAnd ? whole + swing : beat;
  return (placed * 60000) / tempo;
}

/** Hit and match windows in ms, as the scorer will use them for this drill and these options. */
export interface ScoringWindows {
  hitWindowMs: number;
  matchWindowMs: number;
}

/**
 * The timed-mode windows: hit = min(90, max(35, beat ms / 8)) unless given; match = max(2 x hit,
 * half the smallest gap between distinct onsets) unless given, and never below the hit window.
 * Onsets are taken after swing, since those are the times the player is measured against.
 *
 * @example
 * scoringWindows(notes, { tempo: 120, mode: 'timed' }) // { hitWindowMs: 62.5, matchWindowMs: 125 } for eighths
 */
export function scoringWindows(expected: readonly DrillNote[], options: ScoreOptions): ScoringWindows {
  checkOptions(options);
  const tempo = options.tempo;
  const swing = options.swing ?? 0.5;
  const beatMs = 60000 / tempo;
  const hit = options.hitWindowMs ?? Math.min(90, Math.max(35, beatMs / 8));
  let match = options.matchWindowMs;
  if (match === undefined) {
    const times = expected.map((n) => expectedTimeMs(n.beat, tempo, swing)).sort((x, y) => x - y);
    let gap = Number.POSITIVE_INFINITY;
    for (let i = 1; i < times.length; i++) {
      const d = times[i] - times[i - 1];
      if (d > 1e-9 && d < gap) gap = d;
    }
    match = Math.max(2 * hit, Number.isFinite(gap) ? gap / 2 : 0);
  }
  return { hitWindowMs: hit, matchWindowMs: Math.max(match, hit) };
}

/** Refuses options no take could be scored with, in words a player can act on. */
export function checkOptions(options: ScoreOptions): void {
  if (options.mode !== 'timed' && options.mode !== 'free') {
    throw new EngineError(`Scoring mode must be "timed" or "free", not "${String(options.mode)}".`);
  }
  if (options.mode === 'timed' && !(Number.isFinite(options.tempo) && options.tempo > 0)) {
    throw new EngineError('The tempo must be a positive number of beats per minute.');
  }
  const swing = options.swing ?? 0.5;
  if (!(swing >= 0.5 && swing <= 0.75)) {
    throw new EngineError('Swing must be between 0.5 (straight) and 0.75.');
  }
  for (const [label, v] of [
    ['hit window', options.hitWindowMs],
    ['match window', options.matchWindowMs],
  ] as const) {
    if (v !== undefined && !(Number.isFinite(v) && v >= 0)) {
      throw new EngineError(`The ${label} must be zero or more milliseconds.`);
    }
  }
  const t = options.inputTransposition ?? 0;
  if (!Number.isInteger(t)) throw new EngineError('Input transposition must be a whole number of semitones.');
}
