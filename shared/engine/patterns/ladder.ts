import { movePair, semitoneInterval } from '../theory/pair-spelling';
import { nameAt, spelledPc } from '../theory/spelling';
import { parseTriad } from '../theory/triads';
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
 * The written pitch classes of a pair on an instrument, a's three then b's: the whole pair moved
 * by the instrument's interval and spelled as one unit, so every interval keeps its name (concert
 * F#/E on a B-flat instrument reads Ab/Gb, B major on alto sax Ab C Eb). The rule holds at
 * concert pitch too: Dbdim/D, typed with a double flat (Db Fb Abb), is written C#dim/D.
 *
 * @example
 * writtenPairPitchClasses(parseTriad('F#'), parseTriad('E'), -2) // [['Ab', 'C', 'Eb'], ['Gb', 'Bb', 'Db']]
 */
export function writtenPairPitchClasses(a: Triad, b: Triad, transposition: number): [string[], string[]] {
  const [wa, wb] = movePair([a.symbol, b.symbol], semitoneInterval(-transposition));
  return [parseTriad(wa).pitchClasses, parseTriad(wb).pitchClasses];
}

/**
 * The ladder of a triad for an instrument's transposition (cached), its written names spelled
 * from `writtenPcs` (root, third, fifth: the pair's written spelling; see writtenPairPitchClasses).
 *
 * @example
 * ladderOf(parseTriad('F'), 0, ['F', 'A', 'C']).name[ladderOf(parseTriad('F'), 0, ['F', 'A', 'C']).indexOf[65]] // 'F4'
 */
export function ladderOf(triad: Triad, transposition: number, writtenPcs: string[]): Ladder {
  const key = `${triad.symbol}|${triad.pitchClasses.join(',')}|${transposition}|${writtenPcs.join(',')}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const concert = triad.pitchClasses.map(spelledPc);
  const written = writtenPcs.map(spelledPc);
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
