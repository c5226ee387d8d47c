/**
 * Where a drill starts: a pair's ladders on an instrument, the triad it starts on, and the
 * default or given start note. Shared by single-pair and progression drills.
 */
import { EngineError } from '../errors';
import type { FilledDrillSpec, PatternDef, TriadPair } from '../types';
import { type Ladders, runCells } from './cells';
import { type Ladder, ladderOf, writtenPairPitchClasses } from './ladder';

const hexCache = new Map<string, Ladders>();

/** The ladders of a pair on an instrument (cached); progression drills share them. */
export function laddersFor(pair: TriadPair, transposition: number): Ladders {
  const key = `${pair.a.symbol}|${pair.b.symbol}|${transposition}`;
  const hit = hexCache.get(key);
  if (hit) return hit;
  // the written part spells the pair as one unit, moved by the instrument's interval
  const [writtenA, writtenB] = writtenPairPitchClasses(pair.a, pair.b, transposition);
  const a = ladderOf(pair.a, transposition, writtenA);
  const b = ladderOf(pair.b, transposition, writtenB);
  const hex: Ladders['hex'] = [];
  const hexIndexOf = new Int16Array(128).fill(-1);
  for (let m = 0; m < 128; m++) {
    const triad = a.indexOf[m] >= 0 ? 'a' : b.indexOf[m] >= 0 ? 'b' : null;
    if (!triad) continue;
    hexIndexOf[m] = hex.length;
    hex.push({ triad, idx: (triad === 'a' ? a : b).indexOf[m], midi: m });
  }
  const ladders = { a, b, hex, hexIndexOf };
  hexCache.set(key, ladders);
  return ladders;
}

/** The triad whose tones the drill starts on: the first cell's (a for every preset). */
export function startLadder(def: PatternDef, ladders: Ladders): Ladder {
  return def.source === 'triads' && def.cells[0].triad === 'b' ? ladders.b : ladders.a;
}

/**
 * Cells that must fit for a default start: the first a cell and the first b cell.
 *
 * @example
 * cellsToFit(presets.weave) // 2
 */
export function cellsToFit(def: PatternDef): number {
  if (def.source === 'scale') return 2;
  const firstA = def.cells.findIndex((c) => c.triad === 'a');
  const firstB = def.cells.findIndex((c) => c.triad === 'b');
  return Math.max(firstA, firstB) + 1;
}

export function defaultStart(def: PatternDef, ladders: Ladders, spec: FilledDrillSpec, descending: boolean): number {
  const lad = startLadder(def, ladders);
  const need = cellsToFit(def);
  const { low, high } = spec.range;
  // the lowest tone of the triad in the range going up, the highest going down
  const step = descending ? -1 : 1;
  const edge = descending ? high : low;
  const first = lad.indexOf[edge] >= 0 ? lad.indexOf[edge] : descending ? lad.below[edge] : lad.above[edge];
  for (let i = first; i >= 0 && i < lad.midi.length; i += step) {
    const start = lad.midi[i];
    if (start < low || start > high) break;
    const notes = runCells(def, ladders, { start, range: spec.range, descending, maxCells: need });
    if (notes.length > 0 && notes[notes.length - 1].cell === need - 1) return start;
  }
  throw new EngineError(
    `The range ${low}-${high} is too narrow for this pattern on ${spec.pair[0]}/${spec.pair[1]}: widen it.`,
  );
}

/** Moves a start that is not a tone of the first triad to the next one in the drill's direction. */
export function snapStart(start: number, lad: Ladder, descending: boolean): number {
  if (!Number.isInteger(start) || start < 0 || start > 127) {
    throw new EngineError('The start note is a MIDI note number from 0 to 127.');
  }
  if (lad.indexOf[start] >= 0) return start;
  const idx = descending ? lad.below[start] : lad.above[start];
  const m = lad.midi[idx];
  if (m === undefined) throw new EngineError('No tone of the first triad lies that way from the start note.');
  return m;
}
