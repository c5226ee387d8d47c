import { Note } from 'tonal';

const NAME_RE = /^([A-Ga-g])(#{1,2}|b{1,2})?(-?\d{1,2})$/;

/**
 * Reads a note name the player types ("C3", "Bb4", "f#5", "B♭4") as MIDI; scientific octaves,
 * middle C is C4 (MIDI 1.0 numbering, 60). Gives a message that says what is wrong otherwise.
 */
export function parseNoteName(text: string): { midi: number } | { error: string } {
  const t = text.trim().replace(/♭/g, 'b').replace(/♯/g, '#');
  if (t === '') return { error: 'Type a note name with its octave, e.g. Bb4.' };
  if (/^[A-Ga-g](#{1,2}|b{1,2})?$/.test(t)) return { error: `“${t}” needs an octave number: ${t}3, ${t}4 …` };
  const m = NAME_RE.exec(t);
  if (!m)
    return { error: `“${t}” is not a note name: a letter A–G, then # or b if needed, then the octave (e.g. C3, Bb4).` };
  const midi = Note.midi(`${m[1].toUpperCase()}${m[2] ?? ''}${m[3]}`);
  if (midi === null || midi < 0 || midi > 127)
    return { error: `“${t}” is outside the notes MIDI can name (C-1 to G9).` };
  return { midi };
}

/** A MIDI note as a name with its octave (flats, as the key buttons spell them). */
export function noteName(midi: number): string {
  return Note.fromMidi(midi);
}
