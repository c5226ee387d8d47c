import { Note } from 'tonal';
import { QUALITY_INTERVALS } from '../theory/triads';
import { chromaOf, nameAt, rootSpelling, spelledPc } from '../theory/spelling';
import type { Triad } from '../types';

/**
 * A triad's tones over the whole MIDI compass, lowest first, with each tone's position
 * (0 root, 1 third, 2 fifth) and its concert and written names. Built once per triad and
 * transposition, so generating a drill is arithmetic on indices.
 */
export interface Ladder {
  midi: number[];
  pos: number[];
  name: string[];
  written: string[];
  /** ladder index of each MIDI note, or -1 when it is not a tone of the triad */
  indexOf: Int16Array;
  /** ladder index of the first tone strictly above each MIDI note (length when none) */
  above: Int16Array;
  /** ladder index of the last tone strictly below each MIDI note (-1 when none) */
  below: Int16Array;
  /** chroma of each position */
  chroma: number[];
}

const cache = new Map<string, Ladder>();

/**
 * The written pitch classes of a triad on an instrument: the root moved by -transposition and
 * spelled from C Db D Eb E F F# G Ab A Bb B, the tones spelled from it (B major on alto sax is
 * written Ab C Eb). Octave transpositions keep the concert spelling.
 *
 * @example
 * writtenPitchClasses(parseTriad('B'), -9) // ['Ab', 'C', 'Eb']
 */
export function writtenPitchClasses(triad: Triad, transposition: number): string[] {
  if (transposition % 12 === 0) return triad.pitchClasses;
  const root = rootSpelling(chromaOf(triad.root) - transposition);
  return QUALITY_INTERVALS[triad.quality].map((ivl) => Note.transpose(root, ivl));
}

/**
 * The ladder of a triad for an instrument's transposition (cached).
 *
 * @example
 * ladderOf(parseTriad('F'), 0).name[ladderOf(parseTriad('F'), 0).indexOf[65]] // 'F4'
 */
export function ladderOf(triad: Triad, transposition: number): Ladder {
  const key = `${triad.symbol}|${transposition}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const concert = triad.pitchClasses.map(spelledPc);
  const written = writtenPitchClasses(triad, transposition).map(spelledPc);
  const chroma = concert.map((s) => s.chroma);
  const ladder: Ladder = {
    midi: [],
    pos: [],
    name: [],
    written: [],
    indexOf: new Int16Array(128).fill(-1),
    above: new Int16Array(128),
    below: new Int16Array(128),
    chroma,
  };
  for (let m = 0; m < 128; m++) {
    const p = chroma.indexOf(m % 12);
    if (p < 0) continue;
    ladder.indexOf[m] = ladder.midi.length;
    ladder.midi.push(m);
    ladder.pos.push(p);
    ladder.name.push(nameAt(concert[p], m));
    ladder.written.push(nameAt(written[p], m - transposition));
  }
  let next = ladder.midi.length;
  for (let m = 127; m >= 0; m--) {
    ladder.above[m] = next;
    if (ladder.indexOf[m] >= 0) next = ladder.indexOf[m];
  }
  let prev = -1;
  for (let m = 0; m < 128; m++) {
    ladder.below[m] = prev;
    if (ladder.indexOf[m] >= 0) prev = ladder.indexOf[m];
  }
  cache.set(key, ladder);
  return ladder;
}
