import { type Clef, type Ottava, ottavaOctaves } from '@shared/engine';
import { Note } from 'tonal';

const LETTERS = 'CDEFGAB';

export interface SpelledPitch {
  letter: string;
  accidental: string;
  octave: number;
}

/** Reads a spelled name with its octave ("Bb4"); a name that is not one reads as B4, the middle line. */
export function parseWritten(written: string | undefined): SpelledPitch {
  // tonal reads the name; only a full name with an octave places a note.
  const n = Note.get(written ?? '');
  if (n.empty || n.oct === undefined) return { letter: 'B', accidental: '', octave: 4 };
  return { letter: n.letter, accidental: n.acc, octave: n.oct };
}

/**
 * The octave a note is printed in: an 8va line prints it an octave lower than written, a 15ma
 * line two octaves lower; 8vb and 15mb print it higher by as much.
 */
export function printedOctave(written: string | undefined, ottava: Ottava): SpelledPitch {
  const p = parseWritten(written);
  return { ...p, octave: p.octave - ottavaOctaves(ottava) };
}

/** Diatonic steps from C0 ("E4" -> 30), as printed. */
export function diatonicStep(p: SpelledPitch): number {
  return p.octave * 7 + LETTERS.indexOf(p.letter);
}

/** Diatonic step of the middle line: B4 on a treble staff, D3 on a bass staff. */
export function middleLineStep(clef: Clef): number {
  return clef === 'bass' ? 3 * 7 + 1 : 4 * 7 + 6;
}

const CODES: Array<[number, string, number]> = [
  [4, 'w', 0],
  [3, 'h', 1],
  [2, 'h', 0],
  [1.5, 'q', 1],
  [1, 'q', 0],
  [0.75, '8', 1],
  [0.5, '8', 0],
  [0.375, '16', 1],
  [0.25, '16', 0],
  [0.125, '32', 0],
];

/**
 * The printed value of a duration in quarter notes: a triplet member is printed as the value it
 * stands for (a triplet eighth, 1/3 of a quarter, is printed as an eighth).
 */
export function printedValue(quarters: number, inTuplet: boolean): { code: string; dots: number } | null {
  const q = inTuplet ? (quarters * 3) / 2 : quarters;
  const hit = CODES.find(([d]) => Math.abs(d - q) < 1e-6);
  return hit ? { code: hit[1], dots: hit[2] } : null;
}
