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
import VexFlow, { Font, Renderer, StaveConnector } from 'vexflow/core';
import { placeCellTags, placeChordSymbols, placeOttavaLines } from './lane-placement';
import { MarkLayer, type NoteGeometry } from './marks';
import { svgEl } from './svg';
import type { DrawnEvent } from './measure';
import { BRACE_ROOM, narrowestLine, planSystems } from './layout';
import {
  type BuiltSystem,
  buildSystem,
  LEFT,
  layoutSystem,
  moveSystem,
  reach,
  type SystemLayout,
  TOP_LINE,
} from './system';
import { aChromasOf, triadOf } from './triad-of';
import { speedUpVexFlow } from './vexflow-speed';

speedUpVexFlow();

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
  const grand = notation.staves.length > 1;
  const x0 = LEFT + (grand ? BRACE_ROOM : 0);
  // On a narrow screen, lay out at least one measure at a readable spacing and let the drawing
  // scale down to the width (a squeezed bar would run its accidentals and brackets together).
  const width = Math.max(givenWidth, Math.ceil(narrowestLine(notation) + x0 + 6));
  const usable = width - x0 - 6;
  const plans = planSystems(notation.measures, notation.staves.length, usable);

  const tagged = drill.notes.some((n) => n.source !== 'scale');
  // Build each line once at y = 0 to see how far its notes reach, stack the lines, then move
  // each line to its place.
  const layouts: SystemLayout[] = [];
  const systems: BuiltSystem[] = [];
  let cursor = 0;
  for (const plan of plans) {
    const system = buildSystem(
      notation,
      drill,
      plan,
      notation.staves.map(() => 0),
      x0,
    );
    const reaches = notation.staves.map((_c, s) =>
      reach(
        system.built.map((parts) => parts[s]),
        TOP_LINE,
      ),
    );
    const layout = layoutSystem(notation, plan, reaches, cursor, Boolean(options.marksRow), tagged);
    moveSystem(system, layout.staveYs);
    layouts.push(layout);
    systems.push(system);
    cursor = layout.bottom;
  }
  const height = Math.ceil(cursor + 4);

  // Drawn off the page and put in at the end: thousands of elements added to a detached tree
  // cost the browser far less than the same added one by one to the page.
  const stage = document.createElement('div');
  const renderer = new Renderer(stage, Renderer.Backends.SVG);
  renderer.resize(width, height);
  const ctx = renderer.getContext();
  ctx.setFillStyle('currentColor');
  ctx.setStrokeStyle('currentColor');
  const svg = stage.querySelector('svg') as SVGSVGElement;
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
    const { staves, built } = systems[si];
    // staves is [measure][staff]: the line's top staff and its bottom one.
    const topLine = staves[0][0].getYForLine(0);
    const systemBottomLine = staves[0][staves[0].length - 1].getYForLine(4);
    // What this line adds to the drawing starts here (VexFlow appends to the drawing's root).
    const firstOfLine = svg.childElementCount;
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
    // The drawing is not on the page yet, so VexFlow's own lookup (by document id) finds nothing.
    const groups = new Map<string, SVGElement>();
    for (let c: Element | null = svg.children[firstOfLine] ?? null; c; c = c.nextElementSibling)
      if (c.classList.contains('vf-stavenote')) groups.set(c.id, c as SVGElement);
    for (const { event, note } of drawn) {
      const i = event.noteIndex;
      if (i === undefined || i < 0 || i >= drill.notes.length) continue;
      const el = groups.get(`vf-${note.getAttribute('id')}`);
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
      // The notehead's own box: a glyph's text box is the font's whole line, far taller than the
      // head, so a page that lays things over a note measures this instead.
      const ys = note.getYs();
      svgEl(el, 'rect', {
        class: 'sf-head',
        x: begin,
        y: ys[0] - 5,
        width: end - begin,
        height: 10,
        opacity: 0,
        stroke: 'none',
      });
      notes[i] = el;
    }

    placeCellTags(lanes, drill, drawn, layout.cellY, aChromas);
    placeOttavaLines(lanes, notation, plan, built, layout);
    placeChordSymbols(lanes, notation, plan, built, staves, layout.chordY);
  });

  const markGroup = ctx.openGroup('sf-marks') as SVGGElement;
  ctx.closeGroup();
  host.replaceChildren(svg);
  return { notes, height, marks: new MarkLayer(svg, notes, geometry, markGroup) };
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
  for (const head of [...note.children]) {
    if (!head.classList.contains('vf-notehead')) continue;
    for (const text of [...head.children]) {
      if (text.tagName !== 'text' || !isAccidentalGlyph(text.textContent)) continue;
      text.classList.add('sf-accidental');
      note.appendChild(text);
    }
  }
}
