import { EngineError } from '../errors';
import type { PlayedNote } from '../types';

/** Reading past the end of the bytes: turned into a clear message at the top. */
class CutShort extends Error {}

interface RawTrack {
  name: string;
  /** [tick, key, channel, velocity] of note-ons and [tick, key, channel, -1] of note-offs */
  events: number[][];
  endTick: number;
}

const NOT_SMF = 'This is not a Standard MIDI File: it should start with "MThd".';

function readTrack(bytes: Uint8Array, from: number, to: number, tempos: number[][]): RawTrack {
  let p = from;
  const byte = () => {
    if (p >= to) throw new CutShort();
    return bytes[p++];
  };
  const varLen = () => {
    let v = 0;
    for (let i = 0; i < 4; i++) {
      const b = byte();
      v = v * 128 + (b & 0x7f);
      if (!(b & 0x80)) return v;
    }
    throw new EngineError('This MIDI file has a broken length inside a track.');
  };
  const track: RawTrack = { name: '', events: [], endTick: 0 };
  let tick = 0;
  let running = 0;
  while (p < to) {
    tick += varLen();
    let status = byte();
    if (status < 0x80) {
      if (!running) throw new EngineError('This MIDI file has a track event without a status byte.');
      status = running;
      p--;
    }
    if (status === 0xff) {
      const type = byte();
      const len = varLen();
      if (p + len > to) throw new CutShort();
      const data = bytes.subarray(p, p + len);
      p += len;
      if (type === 0x03 && !track.name) track.name = String.fromCharCode(...data);
      if (type === 0x51 && len === 3) tempos.push([tick, (data[0] << 16) | (data[1] << 8) | data[2]]);
      if (type === 0x2f) break;
      continue;
    }
    if (status === 0xf0 || status === 0xf7) {
      const len = varLen();
      if (p + len > to) throw new CutShort();
      p += len;
      continue;
    }
    if (status >= 0xf0) throw new EngineError('This MIDI file holds an event a file may not hold.');
    running = status;
    const kind = status & 0xf0;
    const channel = status & 0x0f;
    const d1 = byte();
    if (kind === 0xc0 || kind === 0xd0) continue;
    const d2 = byte();
    if (kind === 0x90 && d2 > 0) track.events.push([tick, d1, channel, d2]);
    else if (kind === 0x80 || kind === 0x90) track.events.push([tick, d1, channel, -1]);
  }
  track.endTick = tick;
  return track;
}

/** Milliseconds from tick 0 for any tick, from the file's tempo map (or SMPTE timing). */
function clockFor(division: number, tempos: number[][]): (tick: number) => number {
  if (division & 0x8000) {
    const fps = 256 - (division >> 8);
    const msPerTick = 1000 / (fps * (division & 0xff));
    return (tick) => tick * msPerTick;
  }
  const map = [...tempos].sort((x, y) => x[0] - y[0]);
  if (map.length === 0 || map[0][0] > 0) map.unshift([0, 500_000]);
  const starts = [0];
  for (let i = 1; i < map.length; i++) {
    starts.push(starts[i - 1] + ((map[i][0] - map[i - 1][0]) * map[i - 1][1]) / division / 1000);
  }
  return (tick) => {
    let i = map.length - 1;
    while (i > 0 && map[i][0] > tick) i--;
    return starts[i] + ((tick - map[i][0]) * map[i][1]) / division / 1000;
  };
}

function notesOf(track: RawTrack, ms: (tick: number) => number): PlayedNote[] {
  const open = new Map<number, { note: PlayedNote; tick: number }[]>();
  const notes: PlayedNote[] = [];
  for (const [tick, key, channel, velocity] of track.events) {
    const slot = channel * 128 + key;
    if (velocity >= 0) {
      const note: PlayedNote = { midi: key, timeMs: ms(tick), velocity };
      notes.push(note);
      const list = open.get(slot) ?? [];
      list.push({ note, tick });
      open.set(slot, list);
    } else {
      const first = open.get(slot)?.shift();
      if (first) first.note.durationMs = ms(tick) - first.note.timeMs;
    }
  }
  for (const list of open.values()) {
    for (const { note } of list) note.durationMs = Math.max(0, ms(track.endTick) - note.timeMs);
  }
  return notes;
}

function parse(bytes: Uint8Array): PlayedNote[] {
  const text = (at: number) => String.fromCharCode(bytes[at], bytes[at + 1], bytes[at + 2], bytes[at + 3]);
  const u32 = (at: number) => ((bytes[at] << 24) >>> 0) + (bytes[at + 1] << 16) + (bytes[at + 2] << 8) + bytes[at + 3];
  if (bytes.length < 4 || text(0) !== 'MThd') throw new EngineError(NOT_SMF);
  if (bytes.length < 14) throw new CutShort();
  const headerLength = u32(4);
  if (headerLength < 6) throw new EngineError(NOT_SMF);
  const declaredTracks = (bytes[10] << 8) | bytes[11];
  const division = (bytes[12] << 8) | bytes[13];
  if (division === 0) throw new EngineError('This MIDI file gives no timing (its division is 0).');
  const tempos: number[][] = [];
  const tracks: RawTrack[] = [];
  let p = 8 + headerLength;
  while (p < bytes.length && tracks.length < declaredTracks) {
    if (p + 8 > bytes.length) throw new CutShort();
    const type = text(p);
    const len = u32(p + 4);
    const end = p + 8 + len;
    if (end > bytes.length) throw new CutShort();
    if (type === 'MTrk') tracks.push(readTrack(bytes, p + 8, end, tempos));
    p = end;
  }
  if (tracks.length < declaredTracks) throw new CutShort();
  const ms = clockFor(division, tempos);
  const take = tracks.find((t) => t.name.trim() === 'Take');
  const chosen = take ? [take] : tracks;
  const notes = chosen.flatMap((t) => notesOf(t, ms));
  if (notes.length === 0) throw new EngineError('The MIDI file holds no notes.');
  return notes.map((n, i) => ({ n, i })).sort((x, y) => x.n.timeMs - y.n.timeMs || x.i - y.i).map((x) => x.n);
}

/**
 * The notes of a Standard MIDI File as played: the "Take" track when there is one, else every
 * note of every track, in time order, times in ms from tick 0 by the file's own tempo map.
 * Throws EngineError (never a TypeError) for anything that is not a readable file with notes.
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
    return parse(bytes);
  } catch (err) {
    if (err instanceof EngineError) throw err;
    if (err instanceof CutShort) throw new EngineError('This MIDI file is cut short: part of it is missing.');
    throw new EngineError('This MIDI file could not be read: it is not a Standard MIDI File or it is damaged.');
  }
}
