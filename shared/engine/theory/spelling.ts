import { Note } from 'tonal';

/**
 * The root spellings a moved or listed triad takes: one per pitch class, from C.
 *
 * @example
 * ROOT_SPELLINGS[6] // 'F#'
 */
export const ROOT_SPELLINGS = ['C', 'Db', 'D', 'Eb', 'E', 'F', 'F#', 'G', 'Ab', 'A', 'Bb', 'B'] as const;

/**
 * Pitch class of a spelled note or pitch-class name, 0..11 (C = 0); read by tonal, cached.
 *
 * @example
 * chromaOf('Cb') // 11
 */
export function chromaOf(name: string): number {
  let c = chromaCache.get(name);
  if (c === undefined) {
    c = Note.chroma(name) ?? Number.NaN;
    chromaCache.set(name, c);
  }
  return c;
}

const chromaCache = new Map<string, number>();

/**
 * The root spelling from {@link ROOT_SPELLINGS} of a pitch class.
 *
 * @example
 * rootSpelling(8) // 'Ab'
 */
export function rootSpelling(chroma: number): string {
  return ROOT_SPELLINGS[((chroma % 12) + 12) % 12];
}

/** A pitch-class name with what it takes to name it in any octave, computed once. */
export interface SpelledPc {
  pc: string;
  chroma: number;
  /** semitones between the letter's natural note and the spelled one (Cb: -1) */
  alt: number;
  /** chroma of the bare letter */
  letterChroma: number;
}

const spelledCache = new Map<string, SpelledPc>();

/**
 * Reads a pitch-class name with tonal once, so later namings are arithmetic.
 *
 * @example
 * spelledPc('Cb') // { pc: 'Cb', chroma: 11, alt: -1, letterChroma: 0 }
 */
export function spelledPc(pc: string): SpelledPc {
  let found = spelledCache.get(pc);
  if (!found) {
    const n = Note.get(pc);
    found = { pc: n.pc, chroma: n.chroma, alt: n.alt, letterChroma: Note.chroma(n.letter) ?? 0 };
    spelledCache.set(pc, found);
  }
  return found;
}

/**
 * Names a MIDI note with a given pitch-class spelling and the scientific octave that makes the
 * name sound that note (Cb4 is MIDI 59, B#3 is MIDI 60).
 *
 * @example
 * nameAt(spelledPc('D#'), 63) // 'D#4'
 */
export function nameAt(sp: SpelledPc, midi: number): string {
  const octave = Math.round((midi - sp.alt - sp.letterChroma) / 12) - 1;
  return sp.pc + octave;
}
