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
  if (!drill.changes) return { spec: drill.spec, notes, measures: to - from + 1 };
  // over a progression: the chords under those measures, cut to them and re-based the same way
  const end = to * measureLength(drill.spec.meter);
  const changes: NonNullable<Drill['changes']> = [];
  const index = new Map<number, number>();
  drill.changes.forEach((c, i) => {
    const s = Math.max(c.startBeat, offset);
    const e = Math.min(c.startBeat + c.beats, end);
    if (e - s <= 1e-9) return;
    index.set(i, changes.length);
    changes.push({ ...c, startBeat: s - offset, beats: e - s });
  });
  for (const n of notes) if (n.chordIndex !== undefined) n.chordIndex = index.get(n.chordIndex);
  return { spec: drill.spec, notes, measures: to - from + 1, changes };
}
