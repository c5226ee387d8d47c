import { EngineError } from '../errors';
import { instrumentOf } from '../instruments';
import type { DrillSpec, InstrumentId, Meter, MidiRange, PatternDef } from '../types';
import { presets } from './presets';

const SUBDIVISIONS = ['eighth', 'triplet', 'sixteenth'];
const DIRECTIONS = ['up', 'down', 'up-down'];
const ENTRIES = ['start', 'above', 'below', 'same-position', 'next-position'];

/** Reads a pattern id or checks a custom PatternDef, with messages a teacher can act on. */
export function resolvePattern(pattern: DrillSpec['pattern']): PatternDef {
  if (typeof pattern === 'string') {
    if (!Object.hasOwn(presets, pattern)) {
      throw new EngineError(`There is no pattern called "${pattern}".`);
    }
    return presets[pattern];
  }
  if (!pattern || typeof pattern !== 'object') throw new EngineError('A drill needs a pattern.');
  if (!SUBDIVISIONS.includes(pattern.subdivision)) {
    throw new EngineError('A pattern moves in eighths, triplets or sixteenths.');
  }
  if (pattern.source === 'scale') {
    const ok = Array.isArray(pattern.degrees) && pattern.degrees.length > 0 && pattern.degrees.every(Number.isInteger);
    if (!ok || !Number.isInteger(pattern.step)) {
      throw new EngineError('A scale pattern needs whole-number degrees (at least one) and a whole-number step.');
    }
    if (pattern.degrees.length > 64 || Math.abs(pattern.step) > 24 || pattern.degrees.some((d) => Math.abs(d) > 48)) {
      throw new EngineError('A scale pattern may hold at most 64 notes per cell and move at most 24 degrees.');
    }
    return pattern;
  }
  if (pattern.source !== 'triads' || !Array.isArray(pattern.cells) || pattern.cells.length === 0) {
    throw new EngineError('A pattern needs at least one cell.');
  }
  if (pattern.cells.length > 32) throw new EngineError('A pattern may hold at most 32 cells.');
  for (const c of pattern.cells) {
    const ok =
      (c.triad === 'a' || c.triad === 'b') &&
      (c.notes === 3 || c.notes === 4) &&
      (c.shape === 'line' || c.shape === 'leap') &&
      (c.motion === 'up' || c.motion === 'down') &&
      ENTRIES.includes(c.entry);
    if (!ok) {
      throw new EngineError(
        'Each cell names its triad (a or b), 3 or 4 notes, a line or leap shape, up or down, and how it enters.',
      );
    }
  }
  return pattern;
}

export function checkDirection(direction: string): void {
  if (!DIRECTIONS.includes(direction)) throw new EngineError('A drill goes up, down or up-down.');
}

export function resolveInstrument(id: string | undefined): InstrumentId {
  const chosen = id ?? 'piano';
  if (!instrumentOf(chosen)) throw new EngineError(`Sixfold has no instrument called "${chosen}".`);
  return chosen as InstrumentId;
}

export function resolveRange(range: MidiRange | undefined, fallback: MidiRange): MidiRange {
  if (range === undefined) return { ...fallback };
  const ok =
    range &&
    Number.isInteger(range.low) &&
    Number.isInteger(range.high) &&
    range.low >= 0 &&
    range.high <= 127 &&
    range.low <= range.high;
  if (!ok) throw new EngineError('A range runs from a low MIDI note to a high one, both 0 to 127.');
  return { low: range.low, high: range.high };
}

export function resolveTempo(tempo: number | undefined): number {
  const t = tempo ?? 120;
  if (!Number.isFinite(t) || t <= 0 || t > 1000) {
    throw new EngineError('The tempo is quarter notes per minute: a number above 0 (and at most 1000).');
  }
  return t;
}

export function resolveMeter(meter: Meter | undefined): Meter {
  const m = meter ?? [4, 4];
  const ok =
    Array.isArray(m) &&
    m.length === 2 &&
    Number.isInteger(m[0]) &&
    m[0] >= 1 &&
    m[0] <= 32 &&
    [1, 2, 4, 8, 16, 32].includes(m[1]);
  if (!ok)
    throw new EngineError('A meter is beats per measure (1 to 32) over 1, 2, 4, 8, 16 or 32, such as 4/4 or 7/8.');
  return [m[0], m[1]];
}
