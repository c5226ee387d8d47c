import { type Drill, type DrillNote, parseTriad } from '@shared/engine';
import { Note } from 'tonal';

/** Pitch classes (0-11) of the drill's triad a. */
export function aChromasOf(drill: Drill): Set<number> {
  return new Set(parseTriad(drill.spec.pair[0]).pitchClasses.map((pc) => Note.chroma(pc) ?? -1));
}

/** Which triad a note belongs to: its own source, or for scale patterns its pitch class. */
export function triadOf(note: DrillNote, aChromas: Set<number>): 'a' | 'b' {
  if (note.source !== 'scale') return note.source;
  return aChromas.has(((note.midi % 12) + 12) % 12) ? 'a' : 'b';
}
