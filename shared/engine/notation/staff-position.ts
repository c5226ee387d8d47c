import { Note } from 'tonal';
import type { Clef, Ottava } from '../types';

const LETTERS = 'CDEFGAB';

/** A spelled note as the staff needs it: read by tonal once per name, then cached. */
export interface StaffNote {
  /** diatonic position: 7 per octave, C0 = 0 (Cb4 sits where C4 does) */
  step: number;
  /** semitones from the letter (Bb: -1) */
  alt: number;
  midi: number | null;
}

const staffNotes = new Map<string, StaffNote>();

/**
 * Reads a spelled note for the staff.
 *
 * @example
 * staffNote('Cb4') // { step: 28, alt: -1, midi: 59 }
 */
export function staffNote(written: string): StaffNote {
  let found = staffNotes.get(written);
  if (!found) {
    const n = Note.get(written);
    found = { step: (n.oct ?? 4) * 7 + LETTERS.indexOf(n.letter), alt: n.alt, midi: n.midi ?? null };
    staffNotes.set(written, found);
  }
  return found;
}

/** The diatonic position of a spelled note: 7 per octave, C0 = 0 (Cb4 sits where C4 does). */
export function diatonicStep(written: string): number {
  return staffNote(written).step;
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

/**
 * How many octaves an ottava line moves the notes under it on the page: 1 for 8va, 2 for 15ma,
 * negative for the lines below the staff (8vb, 15mb), which print notes higher than written.
 *
 * @example
 * ottavaOctaves(15) // 2: a C8 under a 15ma line is printed as C6
 * ottavaOctaves(-8) // -1
 */
export function ottavaOctaves(ottava: Ottava): number {
  return Math.sign(ottava) * (Math.abs(ottava) === 15 ? 2 : Math.abs(ottava) === 8 ? 1 : 0);
}
