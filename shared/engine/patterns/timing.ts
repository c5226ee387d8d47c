import type { Meter, Subdivision } from '../types';

/** Notes per quarter-note beat for each subdivision. */
export const NOTES_PER_BEAT: Record<Subdivision, number> = { eighth: 2, triplet: 3, sixteenth: 4 };

/** Length of a measure in quarter notes. */
export function measureLength([num, den]: Meter): number {
  return (num * 4) / den;
}

const EPS = 1e-9;

/** Rounds away floating-point dust (7/3 x 3 is 7). */
export function tidy(x: number): number {
  const r = Math.round(x);
  return Math.abs(x - r) < EPS ? r : x;
}

/**
 * Where a beat (quarter notes from 0) falls: its 1-based measure and its 1-based beat in the
 * meter's own unit (eighths in 6/8).
 *
 * @example
 * placeBeat(3.5, [4, 4]) // { measure: 1, beatInMeasure: 4.5 }
 */
export function placeBeat(beat: number, meter: Meter): { measure: number; beatInMeasure: number } {
  const len = measureLength(meter);
  const index = Math.floor(beat / len + EPS);
  return { measure: index + 1, beatInMeasure: tidy(((beat - index * len) * meter[1]) / 4 + 1) };
}

/** Measures needed to hold music that ends at `endBeat`. */
export function measuresFor(endBeat: number, meter: Meter): number {
  return Math.max(1, Math.ceil(endBeat / measureLength(meter) - EPS));
}
