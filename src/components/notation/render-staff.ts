/**
 * Draws a drill with VexFlow (loaded only with this module, as its own chunk). The fonts are
 * the @vexflow-fonts files shipped with the app; nothing is fetched from another host.
 */
import academicoUrl from '@vexflow-fonts/academico/academico.woff2?url';
import bravuraUrl from '@vexflow-fonts/bravura/bravura.woff2?url';
import type { Drill, DrillNote } from '@shared/engine';
import { instruments } from '@shared/engine';
import { aChromasOf, triadOf } from './triad-of';
import VexFlow, {
  Accidental,
  Annotation,
  Beam,
  Font,
  Formatter,
  Renderer,
  Stave,
  StaveNote,
  type Tickable,
  Tuplet,
  Voice,
} from 'vexflow/core';

let fontsReady: Promise<void> | null = null;

/** Loads the music and text fonts once. */
export function loadNotationFonts(): Promise<void> {
  fontsReady ??= Promise.all([Font.load('Bravura', bravuraUrl), Font.load('Academico', academicoUrl)]).then(() => {
    VexFlow.setFonts('Bravura', 'Academico');
  });
  return fontsReady;
}

export interface RenderedStaff {
  /** note index -> the note's SVG group (data-note-index on it), for marks without a redraw */
  notes: SVGElement[];
  height: number;
}

const NOTE_RE = /^([A-Ga-g])(#{1,2}|b{1,2})?(-?\d+)$/;
const ALTER: Record<string, number> = { '': 0, '#': 1, '##': 2, b: -1, bb: -2 };
const ACC_TEXT: Record<number, string> = { [-2]: 'bb', [-1]: 'b', 0: 'n', 1: '#', 2: '##' };

interface Group {
  notes: StaveNote[];
  /** rests that complete a partial group (inside its triplet bracket) */
  rests: StaveNote[];
  triplet: boolean;
}

const LETTERS = 'CDEFGAB';
/** Diatonic steps from C0 of a spelled note ("Eb5" -> 5 * 7 + 2). */
function diatonic(written: string): number {
  const m = NOTE_RE.exec(written);
  if (!m) return 34;
  return Number(m[3]) * 7 + LETTERS.indexOf(m[1].toUpperCase());
}

const measureQuarters = (meter: [number, number]) => (meter[0] * 4) / meter[1];

/** Quarter notes per beam group: a dotted quarter in 6/8, else a quarter. */
const groupQuarters = (meter: [number, number]) => (meter[1] === 8 && meter[0] % 3 === 0 ? 1.5 : 1);

function durationCode(note: DrillNote): string {
  const d = note.duration;
  if (Math.abs(d - 0.25) < 1e-6) return '16';
  if (Math.abs(d - 0.5) < 1e-6 || Math.abs(d - 1 / 3) < 1e-6) return '8';
  if (Math.abs(d - 1) < 1e-6) return 'q';
  return '8';
}

/** Natural width of a measure: room for each note, more for one that carries an accidental. */
function measureWidth(count: number): number {
  return Math.max(110, 34 + count * 27);
}

/**
 * Renders the drill in written pitch into `host` (replacing what was there), breaking measures
 * into systems that fit `width`. Each note's group gets data-note-index and data-triad; the
 * first note of each run of one triad gets a small "a" or "b" below it, so the two triads are
 * told apart without colour too.
 */
export async function renderStaff(host: HTMLElement, drill: Drill, width: number): Promise<RenderedStaff> {
  await loadNotationFonts();
  host.replaceChildren();
  const inst = instruments[drill.spec.instrument];
  const clef = inst.clef;
  const meter = drill.spec.meter;
  const mq = measureQuarters(meter);
  const gq = groupQuarters(meter);
  const aChromas = aChromasOf(drill);

  const byMeasure: DrillNote[][] = Array.from({ length: drill.measures }, () => []);
  drill.notes.forEach((n) => {
    byMeasure[Math.min(drill.measures, Math.max(1, n.measure)) - 1].push(n);
  });
  const indexOf = new Map(drill.notes.map((n, i) => [n, i]));

  // Systems: greedily fill the width, then stretch each full-enough system to the edge.
  const clefRoom = 48;
  const timeRoom = 30;
  const usable = Math.max(260, width - 12);
  const systems: { measures: number[]; widths: number[] }[] = [];
  let current: { measures: number[]; widths: number[] } = { measures: [], widths: [] };
  let used = 0;
  const fullCount = Math.max(1, ...byMeasure.map((m) => m.length));
  byMeasure.forEach((measureNotes, i) => {
    // The last measure's rests take the room its missing notes would have.
    const notes = i === byMeasure.length - 1 ? { length: fullCount } : measureNotes;
    const extra = (current.measures.length === 0 ? clefRoom : 0) + (i === 0 ? timeRoom : 0);
    const w = measureWidth(notes.length) + extra;
    if (current.measures.length > 0 && used + w > usable) {
      systems.push(current);
      current = { measures: [], widths: [] };
      used = 0;
      const w2 = measureWidth(notes.length) + clefRoom;
      current.measures.push(i);
      current.widths.push(w2);
      used = w2;
      return;
    }
    current.measures.push(i);
    current.widths.push(w);
    used += w;
  });
  if (current.measures.length) systems.push(current);
  for (const s of systems) {
    const total = s.widths.reduce((a, b) => a + b, 0);
    const fill = usable / total;
    if (total / usable > 0.55 || systems.length === 1)
      s.widths = s.widths.map((w) => Math.floor(w * Math.min(fill, systems.length === 1 ? 1.6 : fill)));
  }

  // Each system gets the room its highest and lowest notes need (ledger lines, stems, brackets).
  const [topLine, bottomLine] = clef === 'bass' ? [26, 18] : [38, 30]; // diatonic steps of A3/G2, F5/E4
  const staveYs: number[] = [];
  let cursor = 0;
  for (const system of systems) {
    const steps = system.measures.flatMap((mi) => byMeasure[mi].map((n) => diatonic(n.written)));
    const above = Math.max(0, Math.max(...steps, topLine) - topLine) * 5;
    const below = Math.max(0, bottomLine - Math.min(...steps, bottomLine)) * 5;
    // VexFlow draws the top line 40px below the stave's y, the bottom line 40px under that.
    const y = cursor + 10 + above;
    staveYs.push(y);
    cursor = y + 80 + 50 + below;
  }
  const height = cursor + 10;
  const renderer = new Renderer(host as HTMLDivElement, Renderer.Backends.SVG);
  renderer.resize(width, height);
  const ctx = renderer.getContext();
  ctx.setFillStyle('currentColor');
  ctx.setStrokeStyle('currentColor');
  const svg = host.querySelector('svg');
  // The figure around the drawing carries the words; the drawing itself is decoration to a reader.
  svg?.setAttribute('aria-hidden', 'true');
  svg?.setAttribute('viewBox', `0 0 ${width} ${height}`);
  // Scale with the page: the drawing keeps its proportions at any container width.
  svg?.removeAttribute('width');
  svg?.removeAttribute('height');
  svg?.style.setProperty('width', '100%');
  svg?.style.setProperty('height', 'auto');

  const elements: SVGElement[] = new Array(drill.notes.length);
  const styled: Array<{ note: StaveNote; index: number; triad: 'a' | 'b'; written: string }> = [];
  let prevTriad: 'a' | 'b' | null = null;

  systems.forEach((system, si) => {
    let x = 6;
    const y = staveYs[si];
    system.measures.forEach((mi, k) => {
      const w = system.widths[k];
      const stave = new Stave(x, y, w);
      if (k === 0) stave.addClef(clef, 'default', drill.spec.instrument === 'guitar' ? '8vb' : undefined);
      if (mi === 0) stave.addTimeSignature(`${meter[0]}/${meter[1]}`);
      stave.setMeasure(mi + 1);
      if (mi === drill.measures - 1) stave.setEndBarType(3); // final bar line
      stave.setContext(ctx).draw();
      x += w;

      // Accidentals as written music shows them: one holds to the bar line, a natural cancels it.
      const held = new Map<string, number>();
      const groups = new Map<number, Group>();
      const tickables: Tickable[] = [];
      for (const n of byMeasure[mi]) {
        const m = NOTE_RE.exec(n.written);
        const letter = (m?.[1] ?? 'b').toLowerCase();
        const acc = m?.[2] ?? '';
        const octave = m?.[3] ?? '4';
        const sn = new StaveNote({
          keys: [`${letter}${acc}/${octave}`],
          duration: durationCode(n),
          clef,
          autoStem: true,
        });
        const place = `${letter}${octave}`;
        const alter = ALTER[acc] ?? 0;
        if ((held.get(place) ?? 0) !== alter) sn.addModifier(new Accidental(ACC_TEXT[alter]), 0);
        held.set(place, alter);
        const index = indexOf.get(n) ?? 0;
        const triad = triadOf(n, aChromas);
        if (triad !== prevTriad) {
          sn.addModifier(new Annotation(triad).setVerticalJustification(Annotation.VerticalJustify.BOTTOM), 0);
          prevTriad = triad;
        }
        styled.push({ note: sn, index, triad, written: n.written });
        tickables.push(sn);
        const inMeasure = n.beat - mi * mq;
        const g = Math.floor(inMeasure / gq + 1e-6);
        const group = groups.get(g) ?? { notes: [], rests: [], triplet: Math.abs(n.duration - 1 / 3) < 1e-6 };
        group.notes.push(sn);
        groups.set(g, group);
      }
      // Fill the last measure with rests: first the rest of a partial group, then whole beats.
      const last = byMeasure[mi][byMeasure[mi].length - 1];
      if (last) {
        let usedQ = last.beat + last.duration - mi * mq;
        const lastGroup = groups.get(Math.floor((last.beat - mi * mq) / gq + 1e-6));
        while (lastGroup && usedQ + 1e-6 < Math.ceil(usedQ / gq - 1e-6) * gq && usedQ + 1e-6 < mq) {
          const r = new StaveNote({
            keys: [clef === 'bass' ? 'd/3' : 'b/4'],
            duration: `${durationCode(last)}r`,
            clef,
          });
          lastGroup.rests.push(r);
          tickables.push(r);
          usedQ += last.duration;
        }
        while (usedQ + 1 - 1e-6 <= mq) {
          tickables.push(new StaveNote({ keys: [clef === 'bass' ? 'd/3' : 'b/4'], duration: 'qr', clef }));
          usedQ += 1;
        }
        if (usedQ + 0.5 - 1e-6 <= mq) {
          tickables.push(new StaveNote({ keys: [clef === 'bass' ? 'd/3' : 'b/4'], duration: '8r', clef }));
          usedQ += 0.5;
        }
      }
      const voice = new Voice({ numBeats: meter[0], beatValue: meter[1] }).setMode(Voice.Mode.SOFT);
      voice.addTickables(tickables);
      const beams: Beam[] = [];
      const tuplets: Tuplet[] = [];
      for (const group of groups.values()) {
        if (group.triplet)
          tuplets.push(
            new Tuplet([...group.notes, ...group.rests], {
              bracketed: true,
              ratioed: false,
              numNotes: 3,
              notesOccupied: 2,
            }),
          );
        if (group.notes.length > 1) beams.push(new Beam(group.notes));
      }
      new Formatter().joinVoices([voice]).formatToStave([voice], stave);
      voice.draw(ctx, stave);
      for (const b of beams) b.setContext(ctx).draw();
      for (const t of tuplets) t.setContext(ctx).draw();
    });
  });

  for (const { note, index, triad, written } of styled) {
    const el = note.getSVGElement();
    if (!el) continue;
    el.setAttribute('data-note-index', String(index));
    el.setAttribute('data-written', written);
    el.setAttribute('data-triad', triad);
    el.classList.add('sf-note', `sf-triad-${triad}`);
    elements[index] = el;
  }
  return { notes: elements, height };
}
