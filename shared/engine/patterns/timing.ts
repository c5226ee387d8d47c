import { EngineError } from '../errors';
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

/**
 * Whether a meter is compound: eighths (or shorter units) in threes, the beat a dotted unit
 * (6/8, 9/8, 12/8, 3/8; common practice).
 *
 * @example
 * isCompound([6, 8]) // true; isCompound([7, 8]) // false
 */
export function isCompound([num, den]: Meter): boolean {
  return den >= 8 && num % 3 === 0;
}

/**
 * The meter's beats, in quarter notes, in order: quarters in 4/4, dotted quarters in 6/8, and
 * in 5/8 and 7/8 the usual grouping of eighths in twos with a three at the end (2+3, 2+2+3).
 *
 * @example
 * beatGroups([7, 8]) // [1, 1, 1.5]
 */
export function beatGroups(meter: Meter): number[] {
  const [num, den] = meter;
  const unit = 4 / den;
  if (den < 8) return Array.from({ length: num }, () => unit);
  if (isCompound(meter)) return Array.from({ length: num / 3 }, () => 3 * unit);
  if (num === 1) return [unit];
  const groups = Array.from({ length: Math.floor(num / 2) }, () => 2 * unit);
  if (num % 2 === 1) groups[groups.length - 1] = 3 * unit;
  return groups;
}

/**
 * How long one note of a subdivision lasts, in quarter notes, in a meter. A triplet pattern in
 * a compound meter is written as plain units (eighths in 6/8), three to a beat.
 *
 * @example
 * noteLength('triplet', [6, 8]) // 0.5
 */
export function noteLength(subdivision: Subdivision, meter: Meter): number {
  if (subdivision === 'triplet' && isCompound(meter)) return 4 / meter[1];
  return 1 / NOTES_PER_BEAT[subdivision];
}

/**
 * Quarter notes per minute for a drill's tempo: the tempo counts the meter's beat, which is a
 * dotted quarter in compound meters of eighths (6/8, 9/8, 12/8), so it is 1.5 times as many
 * quarters there. Use it wherever beats become milliseconds.
 *
 * @example
 * quarterTempo(120, [6, 8]) // 180
 */
export function quarterTempo(tempo: number, meter: Meter): number {
  return isCompound(meter) ? tempo * beatGroups(meter)[0] : tempo;
}

const SUBDIVISION_WORDS: Record<Subdivision, string> = {
  eighth: 'eighths',
  triplet: 'triplets',
  sixteenth: 'sixteenths',
};

/**
 * Throws EngineError when a pattern's notes cannot fill the meter's beats: a whole number of
 * notes per bar, and in a simple meter a whole number of quarter-note triplets (triplets in 7/8
 * or 5/8 are refused).
 *
 * @example
 * checkMeterFits('Weave', 'triplet', [7, 8]) // throws: triplets cannot fill 7/8
 */
export function checkMeterFits(patternName: string, subdivision: Subdivision, meter: Meter): void {
  const len = measureLength(meter);
  const note = noteLength(subdivision, meter);
  const perBar = len / note;
  const fitsNotes = Math.abs(perBar - Math.round(perBar)) < EPS;
  const fitsTriplets = subdivision !== 'triplet' || isCompound(meter) || Math.abs(len - Math.round(len)) < EPS;
  const beatsFit =
    fitsNotes && fitsTriplets && beatGroups(meter).every((b) => Math.abs(b / note - Math.round(b / note)) < EPS);
  if (!beatsFit) {
    throw new EngineError(
      `${patternName} moves in ${SUBDIVISION_WORDS[subdivision]}, which cannot fill the beats of ${meter[0]}/${meter[1]}: choose another meter or pattern.`,
    );
  }
}
