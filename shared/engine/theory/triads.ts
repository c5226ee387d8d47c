import { Chord, Note } from 'tonal';
import { EngineError } from '../errors';
import type { Quality, Triad } from '../types';

/** tonal's chord type name for each triad quality, and the suffix Sixfold writes. */
const QUALITY_OF_TYPE: Record<string, Quality> = {
  major: 'major',
  minor: 'minor',
  diminished: 'diminished',
  augmented: 'augmented',
};

export const QUALITY_SUFFIX: Record<Quality, string> = {
  major: '',
  minor: 'm',
  diminished: 'dim',
  augmented: 'aug',
};

export const QUALITY_INTERVALS: Record<Quality, string[]> = {
  major: Chord.getChord('major').intervals,
  minor: Chord.getChord('minor').intervals,
  diminished: Chord.getChord('diminished').intervals,
  augmented: Chord.getChord('augmented').intervals,
};

const cache = new Map<string, Triad>();

/**
 * Reads a triad symbol: a major, minor, diminished or augmented tonal chord symbol.
 * Throws EngineError for anything else (tonal reads "F4" as a quartal chord: refused).
 *
 * @example
 * parseTriad('Fm') // { symbol: 'Fm', root: 'F', quality: 'minor', pitchClasses: ['F', 'Ab', 'C'] }
 */
export function parseTriad(symbol: string): Triad {
  const cached = cache.get(symbol);
  if (cached) return { ...cached, pitchClasses: [...cached.pitchClasses] };
  if (typeof symbol !== 'string' || symbol.trim() === '') {
    throw new EngineError('A triad needs a symbol, such as "F", "Fm", "Fdim" or "Faug".');
  }
  const text = symbol.trim();
  const chord = Chord.get(text);
  const quality = QUALITY_OF_TYPE[chord.type];
  if (chord.empty || !chord.tonic || !quality || Note.get(chord.tonic).empty) {
    throw new EngineError(
      `"${text}" is not a triad Sixfold knows: write a root with nothing (major), "m", "dim" or "aug", such as "F", "Fm", "Fdim" or "Faug".`,
    );
  }
  const root = Note.get(chord.tonic).pc;
  const triad: Triad = {
    symbol: root + QUALITY_SUFFIX[quality],
    root,
    quality,
    pitchClasses: chord.notes.map((n) => Note.get(n).pc),
  };
  cache.set(symbol, triad);
  return { ...triad, pitchClasses: [...triad.pitchClasses] };
}

/**
 * The same quality on another root (the root is used as given).
 *
 * @example
 * triadOn('Ab', 'minor').pitchClasses // ['Ab', 'Cb', 'Eb']
 */
export function triadOn(root: string, quality: Quality): Triad {
  return parseTriad(root + QUALITY_SUFFIX[quality]);
}
