import { EngineError } from '../errors';
import { instruments } from '../instruments';
import { pairOf } from '../theory/pairs';
import type { Drill, DrillNote, DrillSpec, FilledDrillSpec, PatternDef } from '../types';
import { type RawNote, runCells } from './cells';
import { generateChangesDrill } from './changes';
import { defaultStart, laddersFor, snapStart, startLadder } from './start';
import { checkDirection, resolveInstrument, resolveMeter, resolvePattern, resolveRange, resolveTempo } from './spec';
import { checkMeterFits, measureLength, measuresFor, noteLength, tidy } from './timing';

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
