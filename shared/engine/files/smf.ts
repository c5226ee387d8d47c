/**
 * Standard MIDI Files through @tonejs/midi: the one import of the package, and a new file with
 * a conductor track (tempo and meter) that drill-midi.ts and take-midi.ts add their tracks to.
 */
import pkg from '@tonejs/midi';
import type { Midi as MidiFile } from '@tonejs/midi';

// The package is CommonJS: under Node ESM and tsx only the default import works (a named import
// throws a SyntaxError); Vite bundles the same line for the browser.
export const { Midi } = pkg;
export type { MidiFile };

/**
 * MIDI velocity (0-127) as @tonejs/midi's 0-1; it writes floor(v * 127), which gives v back
 * exactly for every whole v from 0 to 127.
 *
 * @example
 * toUnit(96) // 0.7559...
 */
export function toUnit(velocity: number): number {
  return velocity / 127;
}

/**
 * A new format 1 file whose conductor track is named `name` and holds the tempo and the meter.
 * Set tempo is 60,000,000 / bpm microseconds per quarter, rounded (Standard MIDI Files 1.0);
 * @tonejs/midi writes floor(60,000,000 / bpm), so it is handed a bpm whose floor is that value.
 * Ticks per quarter are the package's 480 (`file.header.ppq`).
 *
 * @example
 * const file = smfWith('Sixfold', 90, [3, 4]); // set tempo 666,667 us, 3/4
 */
export function smfWith(name: string, bpm: number, meter: readonly [number, number]): MidiFile {
  const file = new Midi();
  file.name = name;
  file.header.tempos = [{ ticks: 0, bpm: 60_000_000 / (Math.round(60_000_000 / bpm) + 0.5) }];
  file.header.timeSignatures = [{ ticks: 0, timeSignature: [meter[0], meter[1]] }];
  file.header.update();
  return file;
}
