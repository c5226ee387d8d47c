import { EngineError } from '../errors';
import type { Drill } from '../types';
import { measureLength } from './timing';

/**
 * Measures `from`..`to` (1-based, inclusive) as a drill of their own, beats re-based so that
 * measure `from` starts at 0; measure numbers are kept. For ladder steps.
 *
 * @example
 * sliceDrill(drill, 2, 3).notes[0].beat // 0, and its measure is 2
 */
export function sliceDrill(drill: Drill, from: number, to: number): Drill {
  if (!Number.isInteger(from) || !Number.isInteger(to) || from < 1 || to < from || to > drill.measures) {
    throw new EngineError(`Choose measures between 1 and ${drill.measures}, the first no later than the last.`);
  }
  const offset = (from - 1) * measureLength(drill.spec.meter);
  const notes = drill.notes
    .filter((n) => n.measure >= from && n.measure <= to)
    .map((n) => ({ ...n, beat: n.beat - offset }));
  return { spec: drill.spec, notes, measures: to - from + 1 };
}
