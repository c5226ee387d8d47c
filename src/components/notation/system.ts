/**
 * Where the staves and lanes of one line of music (a system) go, so nothing on it collides with
 * the line above or below.
 */
import type { Notation } from '@shared/engine';
import type { SystemPlan } from './layout';

/** A staff's top line sits this far below the y its line of music gives it. */
export const TOP_LINE = 40;
const STAFF_HEIGHT = 40;
export const LEFT = 6;

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
