import { EngineError } from '../errors';
import type { PlayedNote } from '../types';
import { countNoteOns } from './note-ons';
import { Midi, type MidiFile } from './smf';

/**
 * The most notes a file may hold; a take holds no more (shared/schemas/takes.ts uses this as its
 * MAX_PLAYED_NOTES). Counted before the file is read, as reading one far larger takes seconds.
 */
export const MAX_FILE_NOTES = 20_000;

const NOT_SMF = 'This is not a Standard MIDI File: it should start with "MThd".';
const CUT_SHORT = 'This MIDI file is cut short: part of it is missing.';
const DAMAGED = 'This MIDI file could not be read: it is not a Standard MIDI File or it is damaged.';
const NO_NOTES = 'The MIDI file holds no notes.';
const TOO_MANY = `The file holds more than ${MAX_FILE_NOTES.toLocaleString('en')} notes; a take holds at most ${MAX_FILE_NOTES.toLocaleString('en')}.`;

/**
 * What @tonejs/midi does not check (it throws a TypeError on a broken header and reads a file cut
 * short as if it were whole): the "MThd" header, and that every track chunk the header promises
 * is there in full. Returns each track chunk as a file of its own (format 0, one track), so the
 * package, which splits a track by channel and keeps its name on the first part only, keeps what
 * came from one track together; a chunk of another type is skipped (Standard MIDI Files 1.0).
 * Counts the note-ons of those chunks on the way and refuses more than MAX_FILE_NOTES, and a
 * length the package would misread (see countNoteOns), before the package sees any of it.
 */
function framed(bytes: Uint8Array): { files: Uint8Array[]; division: number } {
  const id = (at: number) => String.fromCharCode(bytes[at], bytes[at + 1], bytes[at + 2], bytes[at + 3]);
  const u32 = (at: number) => ((bytes[at] << 24) >>> 0) + (bytes[at + 1] << 16) + (bytes[at + 2] << 8) + bytes[at + 3];
  if (bytes.length < 4 || id(0) !== 'MThd') throw new EngineError(NOT_SMF);
  if (bytes.length < 14) throw new EngineError(CUT_SHORT);
  const headerEnd = 8 + u32(4);
  if (headerEnd < 14) throw new EngineError(NOT_SMF);
  const declared = (bytes[10] << 8) | bytes[11];
  const division = (bytes[12] << 8) | bytes[13];
  if (division === 0) throw new EngineError('This MIDI file gives no timing (its division is 0).');
  const header = [0x4d, 0x54, 0x68, 0x64, 0, 0, 0, 6, 0, 0, 0, 1, bytes[12], bytes[13]];
  const files: Uint8Array[] = [];
  let found = 0;
  let noteOns = 0;
  let p = headerEnd;
  while (p < bytes.length && found < declared) {
    if (p + 8 > bytes.length) throw new EngineError(CUT_SHORT);
    const end = p + 8 + u32(p + 4);
    if (end > bytes.length) throw new EngineError(CUT_SHORT);
    if (id(p) === 'MTrk') {
      found++;
      // an empty chunk holds nothing to read (and the package cannot read a file of no events)
      if (end > p + 8) {
        const count = countNoteOns(bytes.subarray(p + 8, end));
        if (count.overlong) throw new EngineError(DAMAGED);
        noteOns += count.noteOns;
        const file = new Uint8Array(header.length + end - p);
        file.set(header);
        file.set(bytes.subarray(p, end), header.length);
        files.push(file);
      }
    }
    p = end;
  }
  if (found < declared || headerEnd > bytes.length) throw new EngineError(CUT_SHORT);
  if (noteOns > MAX_FILE_NOTES) throw new EngineError(TOO_MANY);
  return { files, division };
}

/** Milliseconds from tick 0 for any tick: the tempo map of all the tracks, or SMPTE frames. */
function clockOf(tracks: MidiFile[], division: number): (ticks: number) => number {
  if (division & 0x8000) {
    const msPerTick = 1000 / ((256 - (division >> 8)) * (division & 0xff));
    return (ticks) => ticks * msPerTick;
  }
  // Standard MIDI Files 1.0: 120 bpm until the first set tempo (left alone, the package would
  // time the stretch before it at the first tempo)
  const header = tracks[0].header;
  header.tempos = [{ ticks: 0, bpm: 120 }, ...tracks.flatMap((t) => t.header.tempos)];
  header.update();
  return (ticks) => header.ticksToSeconds(ticks) * 1000;
}

function read(bytes: Uint8Array): PlayedNote[] {
  const { files, division } = framed(bytes);
  let tracks: MidiFile[];
  try {
    tracks = files.map((f) => new Midi(f));
  } catch {
    throw new EngineError(DAMAGED);
  }
  if (tracks.length === 0) throw new EngineError(NO_NOTES);
  const ms = clockOf(tracks, division);
  // the package gives a track's name (its first track-name event) to the first of its parts
  const take = tracks.find((t) => t.tracks[0]?.name.trim() === 'Take');
  const notes: PlayedNote[] = (take ? [take] : tracks).flatMap((file) =>
    file.tracks.flatMap((t) =>
      t.notes.map((n) => {
        const timeMs = ms(n.ticks);
        return {
          midi: n.midi,
          timeMs,
          velocity: Math.round(n.velocity * 127),
          durationMs: ms(n.ticks + n.durationTicks) - timeMs,
        };
      }),
    ),
  );
  // events cut off inside a track chunk come back from the package as missing numbers
  const whole = (n: PlayedNote) =>
    Number.isInteger(n.midi) &&
    n.midi >= 0 &&
    n.midi <= 127 &&
    n.timeMs >= 0 &&
    Number.isFinite(n.timeMs) &&
    Number.isFinite(n.durationMs) &&
    Number.isInteger(n.velocity);
  if (!notes.every(whole)) throw new EngineError(DAMAGED);
  if (notes.length === 0) throw new EngineError(NO_NOTES);
  return notes
    .map((n, i) => ({ n, i }))
    .sort((x, y) => x.n.timeMs - y.n.timeMs || x.i - y.i)
    .map((x) => x.n);
}

/**
 * The notes of a Standard MIDI File as played, read by @tonejs/midi: the "Take" track when there
 * is one, else every note of every track, in time order, times in ms from tick 0 by the file's
 * own tempo map. Throws EngineError (never a TypeError) for anything that is not a readable file
 * with notes.
 *
 * @example
 * midiToPlayed(drillToMidi(drill))[0] // { midi: 65, timeMs: 0, velocity: 96, durationMs: 250 }
 */
export function midiToPlayed(bytes: Uint8Array): PlayedNote[] {
  if (!(bytes instanceof Uint8Array)) {
    if (bytes && typeof bytes === 'object' && (bytes as object) instanceof ArrayBuffer) {
      return midiToPlayed(new Uint8Array(bytes as ArrayBuffer));
    }
    throw new EngineError(NOT_SMF);
  }
  try {
    return read(bytes);
  } catch (err) {
    if (err instanceof EngineError) throw err;
    throw new EngineError(DAMAGED);
  }
}
