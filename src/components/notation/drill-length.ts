import { type Drill, instruments } from '@shared/engine';
import { Note } from 'tonal';

/** A concert MIDI note named as the player reads it (written pitch for a transposing instrument). */
export function writtenName(concert: number, drill: Drill): string {
  return Note.fromMidi(concert - instruments[drill.spec.instrument].transposition);
}

/**
 * Why a drill would look finished but is not what the player asked for: fewer than two bars of
 * notes, or a run that stopped short of the range's far end by more than a cell's reach (so
 * something other than the range's edge ended it). Null when neither.
 */
export function drillLengthProblem(drill: Drill): string | null {
  const { notes, spec } = drill;
  if (notes.length === 0) return 'This drill has no notes: widen the range.';
  const bars = notes[notes.length - 1].measure - notes[0].measure + 1;
  const { low, high } = spec.range;
  const range = `${writtenName(low, drill)}–${writtenName(high, drill)}`;
  const goingUp = spec.direction !== 'down';
  if (bars < 2) {
    return `Only ${bars === 1 ? 'one bar' : `${bars} bars`} (${notes.length} notes): the range ${range} cuts this drill short. Widen the range or start ${goingUp ? 'lower' : 'higher'}.`;
  }
  // The widest cell: a run stops once the next cell would leave the range, so the room it leaves
  // unused should be less than that.
  const cells = new Map<number, number[]>();
  for (const n of notes) cells.set(n.cell, [...(cells.get(n.cell) ?? []), n.midi]);
  let reach = 0;
  for (const m of cells.values()) reach = Math.max(reach, Math.max(...m) - Math.min(...m));
  const top = Math.max(...notes.map((n) => n.midi));
  const bottom = Math.min(...notes.map((n) => n.midi));
  if (goingUp && high - top > reach + 2) {
    return `This drill stops at ${writtenName(top, drill)}, well under the top of its range (${writtenName(high, drill)}): it was cut short.`;
  }
  if (!goingUp && bottom - low > reach + 2) {
    return `This drill stops at ${writtenName(bottom, drill)}, well above the bottom of its range (${writtenName(low, drill)}): it was cut short.`;
  }
  return null;
}
