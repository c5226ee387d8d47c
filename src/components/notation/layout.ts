/** Breaking a drill's measures into systems (lines of music) that fit the width given. */
import type { NotatedMeasure } from '@shared/engine';

export interface SystemPlan {
  /** indices into Notation.measures */
  measures: number[];
  /** each measure's width in px, the first including the clef (and the time signature on the first line) */
  widths: number[];
}

/** Room for the brace of a grand staff, left of the staves. */
export const BRACE_ROOM = 22;
const CLEF_ROOM = 44;
const TIME_ROOM = 28;

/** Natural width of a measure: room for each event on its busiest staff, more for a printed sign. */
export function naturalWidth(measure: NotatedMeasure, staves: number): number {
  let most = 0;
  let signs = 0;
  for (let s = 0; s < staves; s++) {
    const events = measure.events.filter((e) => e.staff === s);
    most = Math.max(most, events.length);
    signs = Math.max(signs, events.filter((e) => e.accidental).length);
  }
  return Math.max(96, 30 + most * 26 + signs * 12);
}

/**
 * Greedily fills lines to the usable width, then stretches every line to the edge but a last
 * line that is short, which keeps its natural spacing, as printed music does.
 */
export function planSystems(measures: NotatedMeasure[], staves: number, usable: number): SystemPlan[] {
  const systems: SystemPlan[] = [];
  let current: SystemPlan = { measures: [], widths: [] };
  let used = 0;
  // The last measure may be mostly rests: give it the room of a full one so the bar reads evenly.
  const full = Math.max(96, ...measures.map((m) => naturalWidth(m, staves)));
  measures.forEach((m, i) => {
    const natural = i === measures.length - 1 ? Math.max(naturalWidth(m, staves), full * 0.8) : naturalWidth(m, staves);
    const first = current.measures.length === 0;
    const w = natural + (first ? CLEF_ROOM : 0) + (i === 0 ? TIME_ROOM : 0);
    if (!first && used + w > usable) {
      systems.push(current);
      const w2 = natural + CLEF_ROOM;
      current = { measures: [i], widths: [w2] };
      used = w2;
      return;
    }
    current.measures.push(i);
    current.widths.push(w);
    used += w;
  });
  if (current.measures.length) systems.push(current);
  systems.forEach((s, i) => {
    const total = s.widths.reduce((a, b) => a + b, 0);
    const fill = usable / total;
    const last = i === systems.length - 1;
    const stretch = systems.length === 1 ? Math.min(fill, 1.6) : !last || total / usable > 0.55 ? fill : 1;
    s.widths = s.widths.map((w) => Math.floor(w * Math.max(stretch, Math.min(1, fill))));
  });
  return systems;
}

/** The narrowest line that holds the drill's busiest measure, a little tighter than its natural width. */
export function narrowestLine(notation: { staves: unknown[]; measures: NotatedMeasure[] }): number {
  const widest = Math.max(96, ...notation.measures.map((m) => naturalWidth(m, notation.staves.length)));
  return widest * 0.85 + CLEF_ROOM + TIME_ROOM;
}
