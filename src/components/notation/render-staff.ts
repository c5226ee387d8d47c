/**
 * Draws a drill's notation model (the engine's notate(drill)) with VexFlow, loaded only with this
 * module as its own chunk. It draws exactly what the model says: its staves and clefs, ottava
 * lines, printed accidentals, beams, triplets, rests, measure numbers and chord symbols; it adds
 * the a/b tag over each cell and, when asked, a row for verdict marks under each line.
 * The fonts are the @vexflow-fonts files shipped with the app; nothing is fetched from another host.
 */
import academicoUrl from '@vexflow-fonts/academico/academico.woff2?url';
import bravuraUrl from '@vexflow-fonts/bravura/bravura.woff2?url';
import type { Drill, Notation } from '@shared/engine';
import VexFlow, { BarlineType, Font, Formatter, Renderer, Stave, StaveConnector } from 'vexflow/core';
import { drawCellTag, drawChordSymbol, drawOttava } from './lanes';
import { MarkLayer, type NoteGeometry } from './marks';
import { type BuiltStaffMeasure, buildStaffMeasure, type DrawnEvent } from './measure';
import { BRACE_ROOM, narrowestLine, planSystems, type SystemPlan } from './layout';
import { vexClef } from './pitch';
import { aChromasOf, triadOf } from './triad-of';

let fontsReady: Promise<void> | null = null;

/** Loads the music and text fonts once. */
export function loadNotationFonts(): Promise<void> {
  fontsReady ??= Promise.all([Font.load('Bravura', bravuraUrl), Font.load('Academico', academicoUrl)]).then(() => {
    VexFlow.setFonts('Bravura', 'Academico');
  });
  return fontsReady;
}

export interface RenderOptions {
  /** keep a row under each line for verdict marks */
  marksRow?: boolean;
}

export interface RenderedStaff {
  /** note index -> the note's SVG group (data-index on it) */
  notes: SVGElement[];
  height: number;
  /** verdict marks and the current note, set without a redraw */
  marks: MarkLayer;
}

/** VexFlow puts a stave's top line this far below the stave's y. */
const TOP_LINE = 40;
const STAFF_HEIGHT = 40;
const LEFT = 6;

interface BuiltSystem {
  /** [measure][staff] */
  staves: Stave[][];
  built: BuiltStaffMeasure[][];
}

function buildSystem(notation: Notation, drill: Drill, plan: SystemPlan, staveYs: number[], x0: number): BuiltSystem {
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

/** How far a staff's drawing reaches above its top line and below its bottom line, in px. */
function reach(parts: BuiltStaffMeasure[], topLine: number): { above: number; below: number } {
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

interface SystemLayout {
  staveYs: number[];
  /** lanes: y of the chord symbols' baseline, the cell tags' centre, marks row centre */
  chordY: number;
  cellY: number;
  marksY: number;
  /** per staff: y of an 8va line above it and an 8vb line below it */
  ottavaUp: number[];
  ottavaDown: number[];
  bottom: number;
}

const hasOttava = (notation: Notation, plan: SystemPlan, staff: number, kind: 8 | -8) =>
  plan.measures.some((mi) =>
    notation.measures[mi].events.some((e) => e.staff === staff && e.kind === 'note' && e.ottava === kind),
  );

function layoutSystem(
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
    const up = hasOttava(notation, plan, s, 8) ? 20 : 0;
    const down = hasOttava(notation, plan, s, -8) ? 20 : 0;
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

/**
 * Renders the drill into `host` (replacing what was there), in lines that fit `width`. Each
 * note's group carries data-index (into drill.notes), data-verdict, data-settled, data-written
 * and its triad as a class.
 */
export async function renderStaff(
  host: HTMLElement,
  drill: Drill,
  notation: Notation,
  givenWidth: number,
  options: RenderOptions = {},
): Promise<RenderedStaff> {
  await loadNotationFonts();
  host.replaceChildren();
  const grand = notation.staves.length > 1;
  const x0 = LEFT + (grand ? BRACE_ROOM : 0);
  // On a narrow screen, lay out at least one measure at a readable spacing and let the drawing
  // scale down to the width (a squeezed bar would run its accidentals and brackets together).
  const width = Math.max(givenWidth, Math.ceil(narrowestLine(notation) + x0 + 6));
  const usable = width - x0 - 6;
  const plans = planSystems(notation.measures, notation.staves.length, usable);

  const tagged = drill.notes.some((n) => n.source !== 'scale');
  // First pass: build each line at y = 0 to see how far its notes reach, then stack the lines.
  const layouts: SystemLayout[] = [];
  let cursor = 0;
  for (const plan of plans) {
    const trial = buildSystem(
      notation,
      drill,
      plan,
      notation.staves.map(() => 0),
      x0,
    );
    const reaches = notation.staves.map((_c, s) =>
      reach(
        trial.built.map((parts) => parts[s]),
        TOP_LINE,
      ),
    );
    const layout = layoutSystem(notation, plan, reaches, cursor, Boolean(options.marksRow), tagged);
    layouts.push(layout);
    cursor = layout.bottom;
  }
  const height = Math.ceil(cursor + 4);

  const renderer = new Renderer(host as HTMLDivElement, Renderer.Backends.SVG);
  renderer.resize(width, height);
  const ctx = renderer.getContext();
  ctx.setFillStyle('currentColor');
  ctx.setStrokeStyle('currentColor');
  const svg = host.querySelector('svg') as SVGSVGElement;
  // The figure around the drawing carries the words; the drawing itself is decoration to a reader.
  svg.setAttribute('aria-hidden', 'true');
  svg.setAttribute('viewBox', `0 0 ${width} ${height}`);
  // Scale with the page: the drawing keeps its proportions at any container width.
  svg.removeAttribute('width');
  svg.removeAttribute('height');
  svg.style.setProperty('width', '100%');
  svg.style.setProperty('height', 'auto');

  const notes: SVGElement[] = new Array(drill.notes.length);
  const geometry: NoteGeometry[] = new Array(drill.notes.length);
  const aChromas = aChromasOf(drill);
  const lanes = ctx.openGroup('sf-lanes') as SVGGElement;
  ctx.closeGroup();

  plans.forEach((plan, si) => {
    const layout = layouts[si];
    const { staves, built } = buildSystem(notation, drill, plan, layout.staveYs, x0);
    // staves is [measure][staff]: the line's top staff and its bottom one.
    const topLine = staves[0][0].getYForLine(0);
    const systemBottomLine = staves[0][staves[0].length - 1].getYForLine(4);
    staves.forEach((row, k) => {
      for (const st of row) st.setContext(ctx).draw();
      if (grand) {
        const [upper, lower] = row;
        if (k === 0) {
          ctx.openGroup('sf-brace');
          new StaveConnector(upper, lower).setType('brace').setContext(ctx).draw();
          new StaveConnector(upper, lower).setType('singleLeft').setContext(ctx).draw();
          ctx.closeGroup();
        }
        const last = plan.measures[k] === notation.measures.length - 1;
        new StaveConnector(upper, lower)
          .setType(last ? 'boldDoubleRight' : 'singleRight')
          .setContext(ctx)
          .draw();
      }
      built[k].forEach((p, s) => {
        p.voice.draw(ctx, row[s]);
        for (const b of p.beams) b.setContext(ctx).draw();
        for (const t of p.tuplets) t.setContext(ctx).draw();
      });
    });

    const drawn: DrawnEvent[] = built.flatMap((parts) => parts.flatMap((p) => p.notes));
    for (const { event, note } of drawn) {
      const i = event.noteIndex;
      if (i === undefined || i < 0 || i >= drill.notes.length) continue;
      const el = note.getSVGElement();
      const begin = note.getNoteHeadBeginX();
      const end = note.getNoteHeadEndX();
      geometry[i] = { x: (begin + end) / 2, laneY: layout.marksY, top: topLine - 10, bottom: systemBottomLine + 10 };
      if (!el) continue;
      const triad = triadOf(drill.notes[i], aChromas);
      el.setAttribute('data-index', String(i));
      el.setAttribute('data-note-index', String(i));
      el.setAttribute('data-written', event.written ?? drill.notes[i].written);
      el.setAttribute('data-triad', triad);
      el.setAttribute('data-verdict', '');
      el.setAttribute('data-settled', 'false');
      el.classList.add('sf-note', `sf-triad-${triad}`);
      liftAccidentals(el);
      notes[i] = el;
    }

    // Cell tags: one per run of notes of one cell on this line. A scale pattern's cells are steps
    // of the six-note scale, not triads: its notes keep their triad's colour and go untagged
    // (a tag per note would bury the line in letters).
    const ordered = drawn
      .filter((d) => d.event.noteIndex !== undefined && drill.notes[d.event.noteIndex].source !== 'scale')
      .sort((a, b) => (a.event.noteIndex ?? 0) - (b.event.noteIndex ?? 0));
    let run: DrawnEvent[] = [];
    const flush = () => {
      if (run.length === 0) return;
      const first = drill.notes[run[0].event.noteIndex!];
      drawCellTag(
        lanes,
        { x0: run[0].note.getNoteHeadBeginX(), x1: run[run.length - 1].note.getNoteHeadEndX() },
        layout.cellY,
        triadOf(first, aChromas),
        first.cell,
      );
      run = [];
    };
    const keyOf = (d: DrawnEvent) => {
      const n = drill.notes[d.event.noteIndex!];
      return `${n.cell}:${n.source}`;
    };
    for (const d of ordered) {
      if (run.length && keyOf(run[0]) !== keyOf(d)) flush();
      run.push(d);
    }
    flush();

    // Ottava lines, per staff, over runs of notes under one sign.
    notation.staves.forEach((_clef, s) => {
      const onStaff = built.flatMap((parts) => parts[s].notes);
      let start = -1;
      for (let j = 0; j <= onStaff.length; j++) {
        const o = j < onStaff.length ? onStaff[j].event.ottava : 0;
        const prev = start >= 0 ? onStaff[start].event.ottava : 0;
        if (start >= 0 && o !== prev) {
          const kind = prev as 8 | -8;
          const last = onStaff[j - 1];
          const next = nextEventOnStaff(notation, plan.measures[plan.measures.length - 1], s);
          const closes = j < onStaff.length || !next || next.ottava !== kind;
          drawOttava(
            lanes,
            { x0: onStaff[start].note.getNoteHeadBeginX() - 2, x1: last.note.getNoteHeadEndX() + 4 },
            kind === 8 ? layout.ottavaUp[s] : layout.ottavaDown[s],
            kind,
            closes,
          );
          start = -1;
        }
        if (start < 0 && o !== 0 && j < onStaff.length) start = j;
      }
    });

    // Chord symbols: each over the event where it starts (or the measure's start).
    plan.measures.forEach((mi, k) => {
      const measure = notation.measures[mi];
      const symbols = measure.chords?.length
        ? measure.chords
        : measure.chord
          ? [{ start: 0, chord: measure.chord }]
          : [];
      const events = built[k].flatMap((p) => [...p.notes, ...p.rests]);
      for (const c of symbols) {
        const at = events.find((d) => Math.abs(d.event.start - c.start) < 1e-6);
        const x = at ? at.note.getNoteHeadBeginX() : staves[k][0].getNoteStartX();
        drawChordSymbol(lanes, x, layout.chordY, c.chord);
      }
    });
  });

  const markGroup = ctx.openGroup('sf-marks') as SVGGElement;
  ctx.closeGroup();
  return { notes, height, marks: new MarkLayer(svg, notes, geometry, markGroup) };
}

/** The first note on a staff after a measure, to see whether an ottava line runs on. */
function nextEventOnStaff(notation: Notation, measureIndex: number, staff: number) {
  for (let mi = measureIndex + 1; mi < notation.measures.length; mi++) {
    const e = notation.measures[mi].events.find((ev) => ev.staff === staff && ev.kind === 'note');
    if (e) return e;
  }
  return undefined;
}

/** SMuFL's accidentals (flat, natural, sharp and their doubles) sit at U+E260..U+E26F. */
const isAccidentalGlyph = (t: string | null) => {
  const c = t?.codePointAt(0) ?? 0;
  return c >= 0xe260 && c <= 0xe26f;
};

/**
 * VexFlow draws a note's accidental inside its notehead group; move it out, so the sign is
 * printed in the text colour (not the triad's) and can be found as .sf-accidental.
 */
function liftAccidentals(note: SVGElement): void {
  for (const head of note.querySelectorAll('.vf-notehead')) {
    for (const text of head.querySelectorAll('text')) {
      if (!isAccidentalGlyph(text.textContent)) continue;
      text.classList.add('sf-accidental');
      note.appendChild(text);
    }
  }
}
