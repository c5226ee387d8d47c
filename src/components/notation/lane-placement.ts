/**
 * Where the lanes' contents go on an engraved line: a tag over each cell, ottava lines over the
 * notes the model puts under one, chord symbols over the events they start on.
 */
import type { Drill, Notation, Ottava } from '@shared/engine';
import type { EngravedSystem, PlacedEvent } from './engrave';
import { drawCellTag, drawChordSymbol, drawOttava } from './lanes';
import type { SystemPlan } from './layout';
import type { SystemLayout } from './system';
import { triadOf } from './triad-of';

/** The notes drawn on a line, every staff. */
export const notesOf = (system: EngravedSystem): PlacedEvent[] =>
  system.measures.flatMap((m) => m.events.flatMap((row) => row.filter((p) => p.event.kind === 'note')));

export function placeCellTags(
  lanes: Element,
  drill: Drill,
  drawn: PlacedEvent[],
  y: number,
  aChromas: Set<number>,
): void {
  // Cell tags: one per run of notes of one cell on this line. A scale pattern's cells are steps
  // of the six-note scale, not triads: its notes keep their triad's colour and go untagged
  // (a tag per note would bury the line in letters).
  const ordered = drawn
    .filter((d) => d.event.noteIndex !== undefined && drill.notes[d.event.noteIndex]?.source !== 'scale')
    .sort((a, b) => (a.event.noteIndex ?? 0) - (b.event.noteIndex ?? 0));
  let run: PlacedEvent[] = [];
  const flush = () => {
    if (run.length === 0) return;
    const first = drill.notes[run[0].event.noteIndex!];
    const last = run[run.length - 1];
    drawCellTag(lanes, { x0: run[0].x, x1: last.x + last.w }, y, triadOf(first, aChromas), first.cell);
    run = [];
  };
  const keyOf = (d: PlacedEvent) => {
    const n = drill.notes[d.event.noteIndex!];
    return `${n.cell}:${n.source}`;
  };
  for (const d of ordered) {
    if (run.length && keyOf(run[0]) !== keyOf(d)) flush();
    run.push(d);
  }
  flush();
}

export function placeOttavaLines(
  lanes: Element,
  notation: Notation,
  plan: SystemPlan,
  system: EngravedSystem,
  layout: SystemLayout,
): void {
  // Ottava lines, per staff, over runs of notes under one sign.
  notation.staves.forEach((_clef, s) => {
    const onStaff = system.measures.flatMap((m) => m.events[s].filter((p) => p.event.kind === 'note'));
    // Every ottava line on one side of a staff on this line sits at one height, clear of all the
    // notes under any of them, so a sign never runs into the notes of the next passage.
    const heights = ([1, -1] as const).map((side) => {
      const under = onStaff.filter((p) => Math.sign(p.event.ottava) === side);
      const lane = side > 0 ? layout.ottavaUp[s] : layout.ottavaDown[s];
      return under.length ? ottavaY(under, system.topLines[s], side > 0, lane) : lane;
    });
    let start = -1;
    for (let j = 0; j <= onStaff.length; j++) {
      const o = j < onStaff.length ? onStaff[j].event.ottava : 0;
      const prev = start >= 0 ? onStaff[start].event.ottava : 0;
      if (start >= 0 && o !== prev) {
        const kind = prev as Exclude<Ottava, 0>;
        const last = onStaff[j - 1];
        const next = nextEventOnStaff(notation, plan.measures[plan.measures.length - 1], s);
        const closes = j < onStaff.length || !next || next.ottava !== kind;
        drawOttava(
          lanes,
          { x0: onStaff[start].x - 2, x1: last.x + last.w + 4 },
          kind > 0 ? heights[0] : heights[1],
          kind,
          closes,
        );
        start = -1;
      }
      if (start < 0 && o !== 0 && j < onStaff.length) start = j;
    }
  });
}

export function placeChordSymbols(
  lanes: Element,
  notation: Notation,
  plan: SystemPlan,
  system: EngravedSystem,
  y: number,
): void {
  // Chord symbols: each over the event where it starts; a chord that goes on into a new line is
  // shown again at its start (common practice), not in every bar it lasts.
  const startsGiven = notation.measures.some((m) => m.chords !== undefined);
  plan.measures.forEach((mi, k) => {
    const measure = notation.measures[mi];
    const placed = system.measures[k];
    const symbols = [...(startsGiven ? (measure.chords ?? []) : [])];
    const atStart = symbols.some((c) => Math.abs(c.start) < 1e-6);
    if (measure.chord && !atStart && (!startsGiven || k === 0)) symbols.unshift({ start: 0, chord: measure.chord });
    const events = placed.events.flat();
    for (const c of symbols) {
      const at = events.find((d) => Math.abs(d.event.start - c.start) < 1e-6);
      drawChordSymbol(lanes, at ? at.x : placed.noteStart, y, c.chord);
    }
  });
}

/** The first note on a staff after a measure, to see whether an ottava line runs on. */
function nextEventOnStaff(notation: Notation, measureIndex: number, staff: number) {
  for (let mi = measureIndex + 1; mi < notation.measures.length; mi++) {
    const e = notation.measures[mi].events.find((ev) => ev.staff === staff && ev.kind === 'note');
    if (e) return e;
  }
  return undefined;
}

/**
 * How high an ottava line sits: just clear of the notes under it (their stems, beams and
 * triplet brackets) and of the staff, never farther out than the lane kept for it on the line.
 */
function ottavaY(run: PlacedEvent[], topLine: number, above: boolean, lane: number): number {
  if (above) {
    let top = topLine - 20;
    for (const p of run) {
      const tuplet = p.event.tuplet !== undefined && p.up ? 16 : 0;
      top = Math.min(top, p.y - 16, Math.min(p.stemEnd, p.stemBase) - 8 - tuplet);
    }
    return Math.max(lane, top);
  }
  let bottom = topLine + 40 + 22;
  for (const p of run) {
    const tuplet = p.event.tuplet !== undefined && !p.up ? 16 : 0;
    bottom = Math.max(bottom, p.y + 14, Math.max(p.stemEnd, p.stemBase) + 10 + tuplet);
  }
  return Math.min(lane, bottom);
}
