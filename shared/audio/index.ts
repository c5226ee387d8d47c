/**
 * Listening to an acoustic instrument: the notes of one melodic line from its samples. Pure and
 * browser-safe (no DOM, no node:*): the browser feeds it from an AudioWorklet, tests feed it
 * samples.
 */
export {
  createNoteDetector,
  DEFAULT_HIGH,
  DEFAULT_LOW,
  DEFAULT_THRESHOLD_DB,
  type DetectOptions,
  detectNotes,
  type NoteDetector,
} from './detector';
