import type { Meter, Subdivision } from '../types';

/**
 * Notes per quarter-note beat for each subdivision.
 *
 * @example
 * NOTES_PER_BEAT.triplet // 3
 */
export const NOTES_PER_BEAT: Record<Subdivision, number> = { eighth: 2, triplet: 3, sixteenth: 4 };

/**
 * Length of a measure in quarter notes.
 *
 * @example
 * measureLength([7, 8]) // 3.5
 */
export function measureLength([num, den]: Meter): number {
  return (num * 4) / den;
}

const EPS = 1e-9;

/**
 * Rounds away floating-point dust.
 *
 * @example
 * tidy(0.1 + 0.2) // 0.30000000000000004 stays; tidy(2.9999999999999996) // 3
 */
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

/**
 * Measures needed to hold music that ends at `endBeat`.
 *
 * @example
 * measuresFor(4.5, [4, 4]) // 2
 */
export function measuresFor(endBeat: number, meter: Meter): number {
  return Math.max(1, Math.ceil(endBeat / measureLength(meter) - EPS));
}
