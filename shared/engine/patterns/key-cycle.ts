import { Chord, Interval, Note } from 'tonal';
import { EngineError } from '../errors';
import { movePair, semitoneInterval } from '../theory/pair-spelling';
import { chromaOf, rootSpelling } from '../theory/spelling';
import { parseTriad } from '../theory/triads';
import type { Drill, DrillSpec, KeyOrder } from '../types';
import { moveChanges } from './changes';
import { generateDrill } from './generate';
import { cellsToFit } from './start';
import { resolvePattern } from './spec';

const STEP: Record<KeyOrder, number> = { chromatic: 1, fourths: 5, fifths: 7 };

function moveChord(chord: string, semitones: number): string {
  const [tonic, type, bass] = Chord.tokenize(chord);
  if (!tonic) return chord;
  const moved = rootSpelling(chromaOf(tonic) + semitones) + type;
  return bass ? `${moved}/${rootSpelling(chromaOf(bass) + semitones)}` : moved;
}

/**
 * A chord moved with its pair: it keeps the interval it had to a's root (so F7 over F/Eb moves
 * to C#7 over C#/B, never Db7), unless that needs a double sharp or flat.
 */
function moveChordWithPair(chord: string, semitones: number, fromA: string, toA: string): string {
  const [tonic, type, bass] = Chord.tokenize(chord);
  if (!tonic) return chord;
  const plain = (n: string) => n !== '' && Math.abs(Note.get(n).alt) <= 1;
  const follow = (name: string) => {
    const moved = Note.transpose(toA, Interval.distance(fromA, name));
    return plain(moved) ? moved : rootSpelling(chromaOf(name) + semitones);
  };
  if (!plain(fromA) || !plain(toA)) return moveChord(chord, semitones);
  const root = follow(tonic);
  return bass ? `${root}${type}/${follow(bass)}` : root + type;
}

/**
 * The same drill in all 12 keys, from the spec's own: up a half step, a fourth or a fifth each
 * time. The moved pair is spelled as one unit (intervals keep their names, no double sharps or
 * flats; the spec's own key keeps the names as typed); a given start moves with the key,
 * then by octaves into the range (else the default start is used).
 *
 * @example
 * inAllKeys({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up' }, 'fourths')
 *   .map((d) => d.spec.pair[0]) // ['F', 'Bb', 'Eb', 'Ab', 'Db', 'F#', 'B', 'E', 'A', 'D', 'G', 'C']
 */
export function inAllKeys(spec: DrillSpec, order: KeyOrder = 'chromatic'): Drill[] {
  if (!Object.hasOwn(STEP, order)) throw new EngineError('A key cycle goes chromatic, in fourths or in fifths.');
  const first = generateDrill(spec);
  const { range } = first.spec;
  const drills: Drill[] = [];
  for (let k = 0; k < 12; k++) {
    const shift = (k * STEP[order]) % 12;
    const moved: DrillSpec = {
      ...spec,
      // the drill's own key keeps the names as typed; every other key spells the moved pair as a unit
      pair: spec.pair && (shift === 0 ? [spec.pair[0], spec.pair[1]] : movePair(spec.pair, semitoneInterval(shift))),
    };
    if (spec.chord !== undefined) {
      moved.chord =
        shift === 0
          ? spec.chord
          : spec.pair && moved.pair
            ? moveChordWithPair(spec.chord, shift, parseTriad(spec.pair[0]).root, parseTriad(moved.pair[0]).root)
            : moveChord(spec.chord, shift);
    }
    if (spec.chord === undefined) delete moved.chord;
    if (spec.pair === undefined) delete moved.pair;
    // a progression moves chord by chord, pinned pairs with it (its own key keeps the names as typed)
    if (spec.changes && shift !== 0) moved.changes = moveChanges(spec.changes, shift);
    drills.push(withMovedStart(moved, spec.start === undefined ? undefined : first.spec.start + shift, range));
  }
  return drills;
}

/** Tries the moved start, then the octaves nearest to it inside the range, then the default start. */
function withMovedStart(moved: DrillSpec, start: number | undefined, range: { low: number; high: number }): Drill {
  if (start !== undefined) {
    const candidates: number[] = [];
    for (let o = 0; o <= 10; o++) {
      for (const s of o === 0 ? [start] : [start - 12 * o, start + 12 * o]) {
        if (s >= range.low && s <= range.high) candidates.push(s);
      }
    }
    // A moved start must leave room for what a default start does: the first a and b cells.
    const need = cellsToFit(resolvePattern(moved.pattern));
    for (const s of candidates) {
      try {
        const drill = generateDrill({ ...moved, start: s });
        if (drill.notes[drill.notes.length - 1].cell >= need - 1) return drill;
      } catch (err) {
        if (!(err instanceof EngineError)) throw err;
      }
    }
  }
  const { start: _drop, ...rest } = moved;
  return generateDrill(rest);
}
