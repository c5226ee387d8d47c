/**
 * Draws a drill's notation model (the engine's notate(drill)) with Sixfold's engraver
 * (engrave.ts), loaded only with this module as its own chunk. It draws exactly what the model
 * says: its staves and clefs, ottava lines, printed accidentals, beams, triplets, rests, measure
 * numbers and chord symbols; it adds the a/b tag over each cell and, when asked, a row for
 * verdict marks under each line. The whole drawing is written as markup and parsed once.
 * The fonts are the @vexflow-fonts files shipped with the app; nothing is fetched from another host.
 */
import academicoUrl from '@vexflow-fonts/academico/academico.woff2?url';
import bravuraUrl from '@vexflow-fonts/bravura/bravura.woff2?url';
import type { Drill, Notation } from '@shared/engine';
import { escapeXml } from '@shared/engine/files/xml-text';
import { engraveSystem, type EngravedSystem, moveSystem, type PlacedEvent, reach, systemMarkup } from './engrave';
import { notesOf, placeCellTags, placeChordSymbols, placeOttavaLines } from './lane-placement';
import { BRACE_ROOM, narrowestLine, planSystems } from './layout';
import { MarkLayer, type NoteGeometry } from './marks';
import { MUSIC_FONT_PX, SPACE } from './smufl';
import { LEFT, layoutSystem, type SystemLayout, TOP_LINE } from './system';
import { aChromasOf, triadOf } from './triad-of';

let fontsReady: Promise<void> | null = null;

/** Loads the music font (Bravura) and the text font (Academico) once. */
export function loadNotationFonts(): Promise<void> {
  fontsReady ??= Promise.all(
    [
      ['Bravura', bravuraUrl],
      ['Academico', academicoUrl],
    ].map(async ([family, url]) => {
      const face = new FontFace(family, `url(${url})`);
      await face.load();
      document.fonts.add(face);
    }),
  ).then(() => undefined);
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
  // Engrave each line with its staves' top lines at 0 to see how far it reaches, stack the
  // lines, then move each line to its place.
  const layouts: SystemLayout[] = [];
  const systems: EngravedSystem[] = [];
  let cursor = 0;
  for (const plan of plans) {
    const system = engraveSystem(notation, drill.spec.meter, plan, x0);
    const reaches = notation.staves.map((_c, s) => reach(system, s));
    const layout = layoutSystem(notation, plan, reaches, cursor, Boolean(options.marksRow), tagged);
    moveSystem(
      system,
      layout.staveYs.map((y) => y + TOP_LINE),
    );
    layouts.push(layout);
    systems.push(system);
    cursor = layout.bottom;
  }
  const height = Math.ceil(cursor + 4);

  const geometry: NoteGeometry[] = new Array(drill.notes.length);
  const aChromas = aChromasOf(drill);
  const noteAttributes = (p: PlacedEvent) => {
    const i = p.event.noteIndex;
    if (i === undefined || i < 0 || i >= drill.notes.length) return null;
    const triad = triadOf(drill.notes[i], aChromas);
    const written = escapeXml(p.event.written ?? drill.notes[i].written);
    return {
      classes: `sf-note sf-triad-${triad}`,
      attributes: `data-index="${i}" data-note-index="${i}" data-written="${written}" data-triad="${triad}" data-verdict="" data-settled="false"`,
    };
  };
  // The figure around the drawing carries the words; the drawing itself is decoration to a
  // reader. It scales with the page: the drawing keeps its proportions at any container width.
  const parts = [
    `<svg xmlns="http://www.w3.org/2000/svg" aria-hidden="true" viewBox="0 0 ${width} ${height}" style="width: 100%; height: auto;" pointer-events="none" fill="currentColor" font-family="Bravura" font-size="${MUSIC_FONT_PX}"><g class="sf-lanes"></g>`,
  ];
  for (const system of systems) parts.push(systemMarkup(system, noteAttributes));
  parts.push('<g class="sf-marks"></g></svg>');
  const holder = document.createElement('div');
  holder.innerHTML = parts.join('');
  const svg = holder.firstElementChild as SVGSVGElement;
  const lanes = svg.firstElementChild as SVGGElement;
  const markGroup = svg.lastElementChild as SVGGElement;
  plans.forEach((plan, si) => {
    const layout = layouts[si];
    const system = systems[si];
    const drawn = notesOf(system);
    const top = system.topLines[0] - 10;
    const bottom = system.topLines[system.topLines.length - 1] + 4 * SPACE + 10;
    for (const p of drawn) {
      const i = p.event.noteIndex;
      if (i !== undefined && i >= 0 && i < drill.notes.length)
        geometry[i] = { x: p.x + p.w / 2, laneY: layout.marksY, top, bottom };
    }
    placeCellTags(lanes, drill, drawn, layout.cellY, aChromas);
    placeOttavaLines(lanes, notation, plan, system, layout);
    placeChordSymbols(lanes, notation, plan, system, layout.chordY);
  });
  const notes: SVGElement[] = new Array(drill.notes.length);
  for (const el of svg.querySelectorAll<SVGElement>('.sf-note')) notes[Number(el.getAttribute('data-index'))] = el;
  host.replaceChildren(svg);
  return { notes, height, marks: new MarkLayer(svg, notes, geometry, markGroup) };
}
