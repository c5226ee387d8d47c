import { Note } from 'tonal';
import type { Clef } from '../types';

const LETTERS = 'CDEFGAB';

/** The diatonic position of a spelled note: 7 per octave, C0 = 0 (Cb4 sits where C4 does). */
export function diatonicStep(written: string): number {
  const n = Note.get(written);
  return (n.oct ?? 4) * 7 + LETTERS.indexOf(n.letter);
}

/** Bottom and top line of each clef's staff, as diatonic steps (common practice). */
const LINES: Record<Clef, { bottom: number; top: number; middle: number }> = {
  // E4 .. F5, middle line B4; the octave clef is read from the written names, which already
  // sit an octave above the sound
  treble: { bottom: 4 * 7 + 2, top: 5 * 7 + 3, middle: 4 * 7 + 6 },
  'treble-8vb': { bottom: 4 * 7 + 2, top: 5 * 7 + 3, middle: 4 * 7 + 6 },
  // G2 .. A3, middle line D3
  bass: { bottom: 2 * 7 + 4, top: 3 * 7 + 5, middle: 3 * 7 + 1 },
};

/**
 * Ledger lines a note at a diatonic step needs on a clef's staff: positive above the staff,
 * negative below, 0 on it. A note in the space just past a ledger line needs only that line.
 *
 * @example
 * ledgerLines(diatonicStep('C4'), 'treble') // -1
 * ledgerLines(diatonicStep('A6'), 'treble') // 4
 */
export function ledgerLines(step: number, clef: Clef): number {
  const { bottom, top } = LINES[clef];
  if (step > top) return Math.floor((step - top) / 2);
  if (step < bottom) return -Math.floor((bottom - step) / 2);
  return 0;
}

/**
 * The staff's middle line, as a diatonic step (stems turn there).
 *
 * @example
 * middleLine('treble') === diatonicStep('B4') // true
 */
export function middleLine(clef: Clef): number {
  return LINES[clef].middle;
}
