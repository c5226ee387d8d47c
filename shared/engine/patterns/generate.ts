import { EngineError } from '../errors';
import { instruments } from '../instruments';
import { pairOf } from '../theory/pairs';
import type { Drill, DrillNote, DrillSpec, FilledDrillSpec, PatternDef, TriadPair } from '../types';
import { type Ladders, type RawNote, runCells } from './cells';
import { generateChangesDrill } from './changes';
import { type Ladder, ladderOf, writtenPairPitchClasses } from './ladder';
import { checkDirection, resolveInstrument, resolveMeter, resolvePattern, resolveRange, resolveTempo } from './spec';
import { checkMeterFits, measureLength, measuresFor, noteLength, tidy } from './timing';

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

/**
 * Places the notes one subdivision apart from beat 0 (in place: they are fresh objects). In a
 * compound meter a triplet pattern is written as plain eighths, three to a dotted-quarter beat.
 */
function place(raw: RawNote[], spec: FilledDrillSpec, def: PatternDef): { notes: DrillNote[]; measures: number } {
  const duration = noteLength(def.subdivision, spec.meter);
  // notes per measure: checkMeterFits has made it a whole number
  const perMeasure = Math.round(measureLength(spec.meter) / duration);
  const unitsPerNote = (duration * spec.meter[1]) / 4;
  // notes per quarter (3 for triplets): dividing by it keeps beats such as 10/3 exact
  const perQuarter = tidy(1 / duration);
  for (let i = 0; i < raw.length; i++) {
    const n = raw[i];
    n.beat = i / perQuarter;
    n.duration = duration;
    const inMeasure = i % perMeasure;
    n.measure = (i - inMeasure) / perMeasure + 1;
    n.beatInMeasure = tidy(inMeasure * unitsPerNote + 1);
  }
  return { notes: raw, measures: measuresFor(raw.length * duration, spec.meter) };
}

/**
 * Generates a drill: the pair moved through a pattern in one direction over a range.
 * Throws EngineError for a spec a player could have got wrong.
 *
 * @example
 * generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up', start: 65 })
 *   .notes.slice(0, 6).map((n) => n.name) // ['F4', 'A4', 'C5', 'Eb5', 'Bb4', 'G4']
 */
export function generateDrill(spec: DrillSpec): Drill {
  if (!spec || typeof spec !== 'object') throw new EngineError('A drill needs a spec.');
  if (spec.changes !== undefined) return generateChangesDrill(spec);
  if (!Array.isArray(spec.pair) || spec.pair.length !== 2) {
    throw new EngineError('A drill needs a pair of two triads, such as ["F", "Eb"].');
  }
  const pair = pairOf(spec.pair[0], spec.pair[1]);
  const def = resolvePattern(spec.pattern);
  checkDirection(spec.direction);
  const instrument = resolveInstrument(spec.instrument);
  const inst = instruments[instrument];
  const filled: FilledDrillSpec = {
    pair: [spec.pair[0], spec.pair[1]],
    pattern: spec.pattern,
    direction: spec.direction,
    range: resolveRange(spec.range, inst.drillRange),
    start: 0,
    instrument,
    tempo: resolveTempo(spec.tempo),
    meter: resolveMeter(spec.meter),
  };
  checkMeterFits(def.name, def.subdivision, filled.meter);
  if (spec.chord !== undefined) filled.chord = spec.chord;
  const ladders = laddersFor(pair, inst.transposition);
  const descending = spec.direction === 'down';
  const lad = startLadder(def, ladders);
  let start: number;
  if (spec.start === undefined) {
    start = defaultStart(def, ladders, filled, descending);
  } else {
    start = snapStart(spec.start, lad, descending);
  }
  filled.start = start;
  const raw = runCells(def, ladders, { start, range: filled.range, descending });
  if (raw.length === 0) {
    throw new EngineError(
      `The first cell from MIDI note ${start} does not fit in the range ${filled.range.low}-${filled.range.high}.`,
    );
  }
  if (spec.direction === 'up-down') {
    // The descent's first cell enters on the highest tone of the first triad at or below the top
    // reached; when that is the note just played, on the next one below, so nothing is dropped
    // and every cell keeps its place in the beat.
    let top = raw[0].midi;
    for (const n of raw) if (n.midi > top) top = n.midi;
    const lastMidi = raw[raw.length - 1].midi;
    let turn: number | undefined = lad.indexOf[top] >= 0 ? top : lad.midi[lad.below[top]];
    if (turn === lastMidi) turn = lad.midi[lad.below[turn]];
    if (turn !== undefined && turn >= filled.range.low) {
      const down = runCells(def, ladders, { start: turn, range: filled.range, descending: true });
      const base = raw[raw.length - 1].cell + 1;
      for (const n of down) {
        n.cell += base;
        raw.push(n);
      }
    }
  }
  const { notes, measures } = place(raw, filled, def);
  return { spec: filled, notes, measures };
}
