/**
 * One line of music (a system): its measures built as VexFlow staves and voices, and where its
 * staves and lanes go so nothing on it collides with the line above or below.
 */
import type { Drill, Notation } from '@shared/engine';
import { BarlineType, Formatter, Stave } from 'vexflow/core';
import type { SystemPlan } from './layout';
import { type BuiltStaffMeasure, buildStaffMeasure } from './measure';
import { vexClef } from './pitch';

/** VexFlow puts a stave's top line this far below the stave's y. */
export const TOP_LINE = 40;
const STAFF_HEIGHT = 40;
export const LEFT = 6;

export interface BuiltSystem {
  /** [measure][staff] */
  staves: Stave[][];
  built: BuiltStaffMeasure[][];
}

export function buildSystem(
  notation: Notation,
  drill: Drill,
  plan: SystemPlan,
  staveYs: number[],
  x0: number,
): BuiltSystem {
  const meter = drill.spec.meter;
  const staves: Stave[][] = [];
  const built: BuiltStaffMeasure[][] = [];
  let x = x0;
  plan.measures.forEach((mi, k) => {
    const measure = notation.measures[mi];
    const w = plan.widths[k];
    const row = notation.staves.map((clef, s) => {
      const stave = new Stave(x, staveYs[s], w);
      if (k === 0) stave.addClef(vexClef(clef), 'default', clef === 'treble-8vb' ? '8vb' : undefined);
      if (mi === 0) stave.addTimeSignature(`${meter[0]}/${meter[1]}`);
      if (s === 0) stave.setMeasure(measure.number);
      if (mi === notation.measures.length - 1) stave.setEndBarType(BarlineType.END);
      return stave;
    });
    // Staves of a grand staff start their notes at the same x.
    const start = Math.max(...row.map((s) => s.getNoteStartX()));
    for (const s of row) s.setNoteStartX(start);
    const parts = notation.staves.map((clef, s) =>
      buildStaffMeasure(
        measure.events.filter((e) => e.staff === s),
        clef,
        meter,
      ),
    );
    parts.forEach((p, s) => {
      p.voice.setStave(row[s]).preFormat();
    });
    const justify = row[0].getNoteEndX() - row[0].getNoteStartX() - Stave.defaultPadding;
    const formatter = new Formatter();
    for (const p of parts) formatter.joinVoices([p.voice]);
    formatter.format(
      parts.map((p) => p.voice),
      justify,
    );
    for (const p of parts) for (const b of p.beams) b.postFormat();
    staves.push(row);
    built.push(parts);
    x += w;
  });
  return { staves, built };
}

/**
 * Moves a built line to its staves' final heights (one per staff), so a line is built and
 * formatted once: the staves take their new y and every note, rest and invisible note takes
 * its staff again, which places its heads and stems. Horizontal spacing and the beams' stem
 * lengths do not depend on the height, so they stay as formatted.
 */
export function moveSystem(system: BuiltSystem, staveYs: number[]): void {
  system.staves.forEach((row, k) => {
    row.forEach((stave, s) => {
      stave.setY(staveYs[s]);
      for (const t of system.built[k][s].voice.getTickables()) t.setStave(stave);
    });
  });
}

/** How far a staff's drawing reaches above its top line and below its bottom line, in px. */
export function reach(parts: BuiltStaffMeasure[], topLine: number): { above: number; below: number } {
  const bottomLine = topLine + STAFF_HEIGHT;
  let top = topLine;
  let bottom = bottomLine;
  for (const p of parts) {
    for (const { note, event } of [...p.notes, ...p.rests]) {
      const ys = note.getYs();
      top = Math.min(top, Math.min(...ys) - (event.accidental ? 14 : 6));
      bottom = Math.max(bottom, Math.max(...ys) + 7);
      if (event.kind === 'note') {
        const { topY, baseY } = note.getStemExtents();
        top = Math.min(top, topY - 4, baseY);
        bottom = Math.max(bottom, topY + 4, baseY);
      }
    }
    for (const t of p.tuplets) {
      const y = t.getYPosition();
      top = Math.min(top, y - 14);
      bottom = Math.max(bottom, y + 14);
    }
  }
  return { above: topLine - top, below: bottom - bottomLine };
}

export interface SystemLayout {
  staveYs: number[];
  /** lanes: y of the chord symbols' baseline, the cell tags' centre, marks row centre */
  chordY: number;
  cellY: number;
  marksY: number;
  /** per staff: y of an 8va or 15ma line above it and an 8vb or 15mb line below it */
  ottavaUp: number[];
  ottavaDown: number[];
  bottom: number;
}

/** Whether a staff on this line has notes under an ottava line above it (8va, 15ma) or below it (8vb, 15mb). */
const hasOttava = (notation: Notation, plan: SystemPlan, staff: number, side: 1 | -1) =>
  plan.measures.some((mi) =>
    notation.measures[mi].events.some((e) => e.staff === staff && e.kind === 'note' && Math.sign(e.ottava) === side),
  );

export function layoutSystem(
  notation: Notation,
  plan: SystemPlan,
  reaches: Array<{ above: number; below: number }>,
  top: number,
  marksRow: boolean,
  tags: boolean,
): SystemLayout {
  const chords = plan.measures.some((mi) => notation.measures[mi].chord || notation.measures[mi].chords?.length);
  const chordLane = chords ? 24 : 0;
  const cellLane = tags ? 22 : 0;
  const staveYs: number[] = [];
  const ottavaUp: number[] = [];
  const ottavaDown: number[] = [];
  let cellY = 0;
  let chordY = 0;
  let prevBottom = 0;
  notation.staves.forEach((_clef, s) => {
    const up = hasOttava(notation, plan, s, 1) ? 20 : 0;
    const down = hasOttava(notation, plan, s, -1) ? 20 : 0;
    // Room over the staff: the notes' own reach, and at least the measure number's.
    const above = Math.max(reaches[s].above, s === 0 ? 16 : 0);
    let topLine: number;
    if (s === 0) {
      topLine = top + 8 + chordLane + cellLane + up + above;
      cellY = topLine - above - up - 11;
      chordY = cellY - 16;
    } else {
      topLine = Math.max(prevBottom + up + above + 18, prevBottom + 56);
    }
    ottavaUp.push(topLine - above - 10);
    const bottomLine = topLine + STAFF_HEIGHT;
    ottavaDown.push(bottomLine + reaches[s].below + 12);
    prevBottom = bottomLine + reaches[s].below + down;
    staveYs.push(topLine - TOP_LINE);
  });
  const marksY = prevBottom + 14;
  return {
    staveYs,
    chordY,
    cellY,
    marksY,
    ottavaUp,
    ottavaDown,
    bottom: prevBottom + (marksRow ? 30 : 8) + 14,
  };
}
