/**
 * Sixfold's engraver: lays out one line of music (a system) from the notation model and writes
 * it as SVG markup. The model has already decided everything a reader sees (clefs, printed
 * accidentals, ottava, beam groups, stem directions, triplets, rests); this places it: x by
 * onset with room for accidentals, y by staff step, stems, beams, flags, ledger lines, dots and
 * triplet brackets (sizes in smufl.ts). Geometry comes first with each staff's top line at 0,
 * so the line's height is known before it is stacked; `moveSystem` then puts it in its place.
 */
import type { Clef, Meter, NotatedEvent, Notation } from '@shared/engine';
import type { SystemPlan } from './layout';
import { diatonicStep, middleLineStep, printedOctave, printedValue } from './pitch';
import { GLYPH, SPACE, THICK, timeSigDigit, timeSigWidth, widthOf } from './smufl';

/** Room for a clef and for the time signature at the start of a measure (layout.ts plans for them). */
const CLEF_AT = 6;
const AFTER_CLEF = 44;
const AFTER_TIME = 28;
const NOTE_PAD = 14;
const END_PAD = 12;
const STEM = 3.5 * SPACE;
const EPS = 1e-6;

type Code = 'w' | 'h' | 'q' | '8' | '16' | '32';
const FLAGS: Record<string, number> = { '8': 1, '16': 2, '32': 3 };

export interface PlacedEvent {
  event: NotatedEvent;
  staff: number;
  /** left edge of the notehead (or the rest) */
  x: number;
  /** width of the notehead (or the rest) */
  w: number;
  /** staff position in half spaces below the top line (0 the top line, 8 the bottom line) */
  pos: number;
  /** y of the head's centre (of a rest, its glyph's origin) */
  y: number;
  code: Code;
  dots: number;
  glyph: string;
  /** notes with a stem */
  up: boolean;
  stemX: number;
  stemBase: number;
  stemEnd: number;
  /** a flag is drawn (a flagged value outside any beam) */
  flag: boolean;
}

export interface PlacedBeam {
  notes: PlacedEvent[];
  up: boolean;
  /** the outer edge: y at the first stem and the slope per px */
  y0: number;
  slope: number;
}

export interface PlacedTuplet {
  staff: number;
  x0: number;
  x1: number;
  y: number;
  up: boolean;
}

export interface PlacedMeasure {
  index: number;
  number: number;
  x: number;
  width: number;
  noteStart: number;
  clef: boolean;
  time: boolean;
  last: boolean;
  /** [staff] */
  events: PlacedEvent[][];
  beams: PlacedBeam[];
  tuplets: PlacedTuplet[];
}

export interface EngravedSystem {
  clefs: Clef[];
  meter: Meter;
  x0: number;
  measures: PlacedMeasure[];
  /** y of each staff's top line (0 until moved) */
  topLines: number[];
}

/** Half spaces below the top line: the top line is F5 on a treble staff, A3 on a bass staff. */
const topStep = (clef: Clef) => (clef === 'bass' ? 3 * 7 + 5 : 5 * 7 + 3);
const positionOf = (e: NotatedEvent, clef: Clef) => topStep(clef) - diatonicStep(printedOctave(e.written, e.ottava));

/**
 * Stem direction for notes on one staff (common practice): the note farthest from the middle
 * line decides; above it (or an even pull) the stems go down, below it up.
 */
export function stemUpFor(events: NotatedEvent[], clef: Clef): boolean {
  const mid = middleLineStep(clef);
  let far = 0;
  for (const e of events) {
    const d = diatonicStep(printedOctave(e.written, e.ottava)) - mid;
    if (Math.abs(d) > Math.abs(far) || (Math.abs(d) === Math.abs(far) && d > 0)) far = d;
  }
  return far < 0;
}

const REST_GLYPH: Record<Code, string> = {
  w: GLYPH.restWhole,
  h: GLYPH.restHalf,
  q: GLYPH.restQuarter,
  '8': GLYPH.rest8th,
  '16': GLYPH.rest16th,
  '32': GLYPH.rest32nd,
};
const ACCIDENTAL_GLYPH = { '#': GLYPH.accidentalSharp, b: GLYPH.accidentalFlat, n: GLYPH.accidentalNatural };
const headGlyph = (code: Code) =>
  code === 'w' ? GLYPH.noteheadWhole : code === 'h' ? GLYPH.noteheadHalf : GLYPH.noteheadBlack;

/** Lays out a line of measures; every y is relative to its staff's top line until `moveSystem`. */
export function engraveSystem(notation: Notation, meter: Meter, plan: SystemPlan, x0: number): EngravedSystem {
  const measureQuarters = (meter[0] * 4) / meter[1];
  const clefs = notation.staves;
  let x = x0;
  const measures = plan.measures.map((mi, k): PlacedMeasure => {
    const measure = notation.measures[mi];
    const width = plan.widths[k];
    const clef = k === 0;
    const time = mi === 0;
    const noteStart = x + (clef ? AFTER_CLEF : 0) + (time ? AFTER_TIME : 0) + NOTE_PAD;
    const noteEnd = x + width - END_PAD;
    const placed = placeMeasure(measure.events, clefs, measureQuarters, noteStart, noteEnd);
    const m: PlacedMeasure = {
      index: mi,
      number: measure.number,
      x,
      width,
      noteStart,
      clef,
      time,
      last: mi === notation.measures.length - 1,
      ...placed,
    };
    x += width;
    return m;
  });
  return { clefs, meter, x0, measures, topLines: clefs.map(() => 0) };
}

function placeMeasure(
  events: NotatedEvent[],
  clefs: Clef[],
  measureQuarters: number,
  noteStart: number,
  noteEnd: number,
): Pick<PlacedMeasure, 'events' | 'beams' | 'tuplets'> {
  // A rest that fills the bar is a whole rest centred in it, in any meter (common practice);
  // everything else takes a slot by its onset, shared by both staves of a grand staff so their
  // beats line up.
  const fillsBar = (e: NotatedEvent) => e.kind === 'rest' && Math.abs(e.duration - measureQuarters) < EPS;
  const printedAs = (e: NotatedEvent): { code: Code; dots: number } => {
    if (fillsBar(e)) return { code: 'w', dots: 0 };
    // A value the model should never give is drawn as an eighth rather than breaking the page.
    const v = printedValue(e.duration, e.tuplet !== undefined) ?? { code: '8', dots: 0 };
    return { code: v.code as Code, dots: v.dots };
  };
  // A flagged value carries its own flag when no other note of its beam group shares the beam.
  const inBeam = new Map<string, number>();
  for (const e of events)
    if (e.kind === 'note' && e.beam !== undefined && FLAGS[printedAs(e).code])
      inBeam.set(`${e.staff}:${e.beam}`, (inBeam.get(`${e.staff}:${e.beam}`) ?? 0) + 1);
  const flagged = (e: NotatedEvent) =>
    e.kind === 'note' &&
    Boolean(FLAGS[printedAs(e).code]) &&
    (e.beam === undefined || (inBeam.get(`${e.staff}:${e.beam}`) ?? 0) < 2);

  // Each onset needs room on its left for an accidental and on its right for its heads or
  // rests, flags and dots; the rest of the bar is shared by duration (a longer note gets more
  // room, less than in proportion: common practice).
  const key = (t: number) => Math.round(t * 1e6) / 1e6;
  const onsets = [...new Set(events.filter((e) => !fillsBar(e)).map((e) => key(e.start)))].sort((a, b) => a - b);
  const left = onsets.map(() => 0);
  const right = onsets.map(() => 0);
  const slotOf = new Map(onsets.map((t, i) => [t, i]));
  for (const e of events) {
    const i = slotOf.get(key(e.start));
    if (i === undefined) continue;
    const { code, dots } = printedAs(e);
    if (e.accidental) left[i] = Math.max(left[i], widthOf(ACCIDENTAL_GLYPH[e.accidental]) + 3);
    const body = widthOf(e.kind === 'rest' ? REST_GLYPH[code] : headGlyph(code));
    right[i] = Math.max(right[i], body + (flagged(e) ? 11 : 0) + (dots ? 3 + 6 * dots : 0));
  }
  const gaps = onsets.slice(0, -1).map((_t, i) => right[i] + 5 + left[i + 1]);
  const weights = onsets.map((t, i) => Math.max(onsets[i + 1] ?? measureQuarters, t + 1 / 16) - t).map((d) => d ** 0.6);
  const totalWeight = weights.reduce((a, b) => a + b, 0) || 1;
  const fixed = (left[0] ?? 0) + gaps.reduce((a, b) => a + b, 0) + (right[right.length - 1] ?? 0);
  const spare = noteEnd - noteStart - fixed;
  // Too little room (a very narrow screen): the gaps shrink alike rather than run into the barline.
  const squeeze = spare < 0 && fixed > 0 ? Math.max(0.5, (noteEnd - noteStart) / fixed) : 1;
  const slotX = new Map<number, number>();
  let cursor = noteStart + (left[0] ?? 0) * squeeze;
  onsets.forEach((t, i) => {
    slotX.set(t, cursor);
    if (i < gaps.length) cursor += gaps[i] * squeeze + (Math.max(0, spare) * weights[i]) / totalWeight;
  });
  const xAt = (t: number) => slotX.get(key(t)) ?? noteStart;

  const placed: PlacedEvent[][] = clefs.map(() => []);
  const beams: PlacedBeam[] = [];
  const tuplets: PlacedTuplet[] = [];
  clefs.forEach((clef, s) => {
    const onStaff = events.filter((e) => e.staff === s).sort((a, b) => a.start - b.start);
    const groupUp = new Map<number, boolean>();
    const byBeam = new Map<number, NotatedEvent[]>();
    for (const e of onStaff) {
      if (e.kind !== 'note' || e.beam === undefined) continue;
      byBeam.set(e.beam, [...(byBeam.get(e.beam) ?? []), e]);
    }
    for (const [id, group] of byBeam) groupUp.set(id, stemUpFor(group, clef));

    const beamed = new Map<number, PlacedEvent[]>();
    const inTuplet = new Map<number, PlacedEvent[]>();
    for (const e of onStaff) {
      const value = printedAs(e);
      const code = value.code;
      let p: PlacedEvent;
      if (e.kind === 'rest') {
        const glyph = REST_GLYPH[code];
        const w = widthOf(glyph);
        // Rests sit in the middle of the staff; a whole rest hangs from the line above the middle.
        const pos = code === 'w' ? 2 : 4;
        const at = fillsBar(e) ? (noteStart + noteEnd) / 2 - w / 2 : xAt(e.start);
        p = {
          event: e,
          staff: s,
          x: at,
          w,
          pos,
          y: pos * 5,
          code,
          dots: value.dots,
          glyph,
          up: true,
          stemX: 0,
          stemBase: 0,
          stemEnd: 0,
          flag: false,
        };
      } else {
        const glyph = headGlyph(code);
        const w = widthOf(glyph);
        const pos = positionOf(e, clef);
        const y = pos * 5;
        const up = e.stem
          ? e.stem === 'up'
          : e.beam !== undefined && groupUp.has(e.beam)
            ? groupUp.get(e.beam)!
            : stemUpFor([e], clef);
        const at = xAt(e.start);
        const half = THICK.stem / 2;
        const stemX = up ? at + w - half : at + half;
        // The stem leaves the head a little off its centre (the font's stem anchors), is three
        // and a half spaces long, longer for two or three beams or flags, and reaches the
        // middle line from a note far off the staff (common practice).
        const flags = FLAGS[code] ?? 0;
        const length = STEM + Math.max(0, flags - 1) * THICK.beamStep;
        const stemBase = up ? y - 1.7 : y + 1.7;
        let stemEnd = up ? y - length : y + length;
        if (up && stemEnd > 20) stemEnd = 20;
        if (!up && stemEnd < 20) stemEnd = 20;
        p = {
          event: e,
          staff: s,
          x: at,
          w,
          pos,
          y,
          code,
          dots: value.dots,
          glyph,
          up,
          stemX,
          stemBase,
          stemEnd,
          flag: flagged(e),
        };
        if (e.beam !== undefined && flags > 0) beamed.set(e.beam, [...(beamed.get(e.beam) ?? []), p]);
      }
      if (e.tuplet !== undefined) inTuplet.set(e.tuplet, [...(inTuplet.get(e.tuplet) ?? []), p]);
      placed[s].push(p);
    }
    for (const group of beamed.values()) {
      if (group.length < 2) continue;
      beams.push(placeBeam(group));
    }
    for (const group of inTuplet.values()) tuplets.push(placeTuplet(group, s));
  });
  return { events: placed, beams, tuplets };
}

/**
 * A beam over a group (common practice): it follows the line from the first note to the last,
 * at most one space of slant (less over close notes), flat when an inner note reaches past both ends; every stem at
 * least three and a half spaces long (more under two or three beams), the shortest exactly so.
 */
function placeBeam(notes: PlacedEvent[]): PlacedBeam {
  const up = notes[0].up;
  const first = notes[0];
  const last = notes[notes.length - 1];
  const span = last.stemX - first.stemX || 1;
  const ends = [first.y, last.y];
  const inner = notes.slice(1, -1);
  const pastEnds = inner.some((n) => (up ? n.y < Math.min(...ends) : n.y > Math.max(...ends)));
  // Close notes get a gentler slant: at most a quarter of the distance between the end stems.
  const most = Math.min(SPACE, Math.max(SPACE / 4, span / 4));
  const rise = pastEnds ? 0 : Math.max(-most, Math.min(most, (last.y - first.y) / 2));
  const slope = rise / span;
  const levels = Math.max(...notes.map((n) => FLAGS[n.code] ?? 1));
  const length = STEM + (levels - 1) * THICK.beamStep;
  let y0 = up ? Number.POSITIVE_INFINITY : Number.NEGATIVE_INFINITY;
  for (const n of notes) {
    const want = (up ? n.y - length : n.y + length) - slope * (n.stemX - first.stemX);
    y0 = up ? Math.min(y0, want) : Math.max(y0, want);
  }
  // A beam far off the staff is brought back to reach the middle line (common practice).
  const mid = 20;
  const nearest = up ? Math.max(y0, y0 + rise) : Math.min(y0, y0 + rise);
  if (up && nearest > mid) y0 -= nearest - mid;
  if (!up && nearest < mid) y0 += mid - nearest;
  for (const n of notes) n.stemEnd = y0 + slope * (n.stemX - first.stemX);
  return { notes, up, y0, slope };
}

/** A triplet bracket on the stem side, clear of the stems, heads and beams under it. */
function placeTuplet(members: PlacedEvent[], staff: number): PlacedTuplet {
  const pitched = members.filter((m) => m.event.kind === 'note');
  const up = pitched.length === 0 || pitched[0].up;
  let y = up ? 0 - SPACE : 4 * SPACE + SPACE;
  for (const m of members) {
    const extent =
      m.event.kind === 'note'
        ? up
          ? Math.min(m.stemEnd, m.y - 6)
          : Math.max(m.stemEnd, m.y + 6)
        : up
          ? m.y - 16
          : m.y + 16;
    y = up ? Math.min(y, extent - 10) : Math.max(y, extent + 10);
  }
  const last = members[members.length - 1];
  return { staff, x0: members[0].x, x1: last.x + last.w, y, up };
}

/** How far a staff's drawing reaches above its top line and below its bottom line, in px. */
export function reach(system: EngravedSystem, staff: number): { above: number; below: number } {
  const topLine = system.topLines[staff];
  const bottomLine = topLine + 4 * SPACE;
  let top = topLine;
  let bottom = bottomLine;
  for (const m of system.measures) {
    for (const p of m.events[staff]) {
      top = Math.min(top, p.y - (p.event.accidental ? 18 : 6));
      bottom = Math.max(bottom, p.y + 7);
      if (p.event.kind === 'note' && p.code !== 'w') {
        top = Math.min(top, Math.min(p.stemEnd, p.stemBase) - 4);
        bottom = Math.max(bottom, Math.max(p.stemEnd, p.stemBase) + 4);
      }
    }
    for (const t of m.tuplets) {
      if (t.staff !== staff) continue;
      top = Math.min(top, t.y - 14);
      bottom = Math.max(bottom, t.y + 14);
    }
  }
  return { above: topLine - top, below: bottom - bottomLine };
}

/** Puts each staff's top line at the y given: every y on the line moves with it. */
export function moveSystem(system: EngravedSystem, topLines: number[]): void {
  const dy = topLines.map((t, s) => t - system.topLines[s]);
  for (const m of system.measures) {
    m.events.forEach((row, s) => {
      for (const p of row) {
        p.y += dy[s];
        p.stemBase += dy[s];
        p.stemEnd += dy[s];
      }
    });
    for (const b of m.beams) b.y0 += dy[b.notes[0].staff];
    for (const t of m.tuplets) t.y += dy[t.staff];
  }
  system.topLines = [...topLines];
}

const r1 = (n: number) => Math.round(n * 10) / 10;

/** What the page sets on a note's group: more classes, and attributes as markup (values escaped). */
export type NoteAttributes = (p: PlacedEvent) => { classes: string; attributes: string } | null;

/**
 * The line as SVG markup, in drawing order: staves, barlines, clefs, time signature and
 * measure numbers; then each note as a group (ledger lines, head, accidental, stem, flag, dot,
 * and an invisible box, the head's own); rests, beams and
 * triplet brackets. `noteAttributes` gives a note's group its attributes (null leaves it bare).
 */
export function systemMarkup(system: EngravedSystem, noteAttributes: NoteAttributes): string {
  const out: string[] = [];
  const grand = system.clefs.length > 1;
  const tops = system.topLines;
  const systemTop = tops[0];
  const systemBottom = tops[tops.length - 1] + 4 * SPACE;
  if (grand) {
    // The brace spans the line's staves; the font draws it one em high, so its size is the span.
    const h = systemBottom - systemTop;
    out.push(
      `<g class="sf-brace"><text x="${r1(system.x0 - 16)}" y="${r1(systemBottom)}" font-size="${r1(h)}">${GLYPH.brace}</text>`,
      `<path d="M${system.x0} ${systemTop}V${systemBottom}" stroke="currentColor" stroke-width="${THICK.thinBarline}"/></g>`,
    );
  }
  for (const m of system.measures) {
    const right = m.x + m.width;
    tops.forEach((top, s) => {
      let d = '';
      for (let l = 0; l < 5; l++) d += `M${r1(m.x)} ${r1(top + l * SPACE)}H${r1(right)}`;
      out.push(
        `<path class="sf-stave" d="${d}" stroke="currentColor" stroke-width="${THICK.staffLine}" data-measure="${m.number}"/>`,
      );
      if (m.clef) {
        const clef = system.clefs[s];
        const glyph = clef === 'bass' ? GLYPH.fClef : clef === 'treble-8vb' ? GLYPH.gClef8vb : GLYPH.gClef;
        // The G clef curls round the second line from the bottom, the F clef sits on the fourth.
        const y = top + (clef === 'bass' ? SPACE : 3 * SPACE);
        out.push(`<text class="sf-clef" x="${r1(m.x + CLEF_AT)}" y="${r1(y)}">${glyph}</text>`);
      }
      if (m.time) {
        const [beats, unit] = system.meter;
        const tx = m.x + (m.clef ? AFTER_CLEF - 4 : CLEF_AT);
        const wide = Math.max(timeSigWidth(beats), timeSigWidth(unit));
        const digits = (n: number, y: number) =>
          `<text x="${r1(tx + (wide - timeSigWidth(n)) / 2)}" y="${r1(y)}">${[...String(n)].map((c) => timeSigDigit(Number(c))).join('')}</text>`;
        out.push(`<g class="sf-time">${digits(beats, top + SPACE)}${digits(unit, top + 3 * SPACE)}</g>`);
      }
    });
    if (m.number > 0)
      out.push(
        `<text class="sf-measure-number" x="${r1(m.x)}" y="${r1(numberY(m, systemTop))}" font-family="Academico, Georgia, serif" font-size="11">${m.number}</text>`,
      );
    // Barlines run through every staff of a grand staff; the last measure ends thin-thick.
    if (m.last) {
      out.push(
        `<path class="sf-barline" d="M${r1(right - THICK.thickBarline - 4.5)} ${systemTop}V${systemBottom}" stroke="currentColor" stroke-width="${THICK.thinBarline}"/>`,
        `<rect class="sf-barline" x="${r1(right - THICK.thickBarline)}" y="${systemTop}" width="${THICK.thickBarline}" height="${systemBottom - systemTop}"/>`,
      );
    } else if (grand) {
      out.push(
        `<path class="sf-barline" d="M${r1(right)} ${systemTop}V${systemBottom}" stroke="currentColor" stroke-width="${THICK.thinBarline}"/>`,
      );
    } else {
      out.push(
        `<path class="sf-barline" d="M${r1(right)} ${systemTop}V${systemTop + 4 * SPACE}" stroke="currentColor" stroke-width="${THICK.thinBarline}"/>`,
      );
    }
    m.events.forEach((row, s) => {
      const top = tops[s];
      for (const p of row)
        out.push(p.event.kind === 'rest' ? restMarkup(p, top) : noteMarkup(p, top, noteAttributes(p)));
    });
    for (const b of m.beams) out.push(beamMarkup(b));
    for (const t of m.tuplets) out.push(tupletMarkup(t));
  }
  return out.join('');
}

/** A measure number sits over the barline, above anything drawn near the start of the bar. */
function numberY(m: PlacedMeasure, systemTop: number): number {
  let y = systemTop - 12;
  const near = m.x + 3 * SPACE;
  for (const p of m.events[0] ?? []) {
    if (p.x >= near) continue;
    y = Math.min(y, p.y - 10);
    if (p.event.kind === 'note' && p.code !== 'w') y = Math.min(y, p.stemEnd - 6);
  }
  for (const t of m.tuplets) if (t.staff === 0 && t.up && t.x0 < near) y = Math.min(y, t.y - 6);
  return y;
}

function noteMarkup(p: PlacedEvent, top: number, attrs: ReturnType<NoteAttributes>): string {
  // A pointer anywhere in the note's box (head, stem, flag) hits the note.
  let s = attrs
    ? `<g class="sf-stavenote ${attrs.classes}" ${attrs.attributes} pointer-events="bounding-box">`
    : '<g class="sf-stavenote" pointer-events="bounding-box">';
  // Ledger lines: every line between the staff and the note, a little wider than the head.
  let ledger = '';
  // (shorter on the left beside an accidental, so the two do not touch)
  const x0 = r1(p.x - (p.event.accidental ? 0.15 : 0.4) * SPACE);
  const x1 = r1(p.x + p.w + 0.4 * SPACE);
  for (let l = -2; l >= p.pos; l -= 2) ledger += `M${x0} ${r1(top + l * 5)}H${x1}`;
  for (let l = 10; l <= p.pos; l += 2) ledger += `M${x0} ${r1(top + l * 5)}H${x1}`;
  if (ledger) s += `<path class="sf-ledger" d="${ledger}" stroke="currentColor" stroke-width="${THICK.ledger}"/>`;
  s += `<text class="sf-notehead" x="${r1(p.x)}" y="${r1(p.y)}">${p.glyph}</text>`;
  if (p.event.accidental) {
    const glyph = ACCIDENTAL_GLYPH[p.event.accidental];
    s += `<text class="sf-accidental" x="${r1(p.x - widthOf(glyph) - 2.5)}" y="${r1(p.y)}">${glyph}</text>`;
  }
  if (p.code !== 'w') {
    s += `<path class="sf-stem" d="M${r1(p.stemX)} ${r1(p.stemBase)}V${r1(p.stemEnd)}" stroke="currentColor" stroke-width="${THICK.stem}"/>`;
    if (p.flag) {
      const flags = FLAGS[p.code];
      const glyph = p.up
        ? [GLYPH.flag8thUp, GLYPH.flag16thUp, GLYPH.flag32ndUp][flags - 1]
        : [GLYPH.flag8thDown, GLYPH.flag16thDown, GLYPH.flag32ndDown][flags - 1];
      s += `<text class="sf-flag" x="${r1(p.stemX - THICK.stem / 2)}" y="${r1(p.stemEnd)}">${glyph}</text>`;
    }
  }
  s += dotsMarkup(p, p.pos % 2 === 0 ? p.y - 5 : p.y);
  // The notehead's own box: a glyph's text box is the font's whole line, far taller than the
  // head, so a page that lays things over a note measures this instead.
  s += `<rect class="sf-head" x="${r1(p.x)}" y="${r1(p.y - 5)}" width="${r1(p.w)}" height="10" opacity="0"/>`;
  return `${s}</g>`;
}

function restMarkup(p: PlacedEvent, top: number): string {
  return `<g class="sf-rest"><text x="${r1(p.x)}" y="${r1(p.y)}">${p.glyph}</text>${dotsMarkup(p, top + 15)}</g>`;
}

function dotsMarkup(p: PlacedEvent, y: number): string {
  let s = '';
  for (let d = 0; d < p.dots; d++)
    s += `<text class="sf-dot" x="${r1(p.x + p.w + 3 + d * 6)}" y="${r1(y)}">${GLYPH.augmentationDot}</text>`;
  return s;
}

function beamMarkup(b: PlacedBeam): string {
  const { notes, up } = b;
  const first = notes[0].stemX;
  const at = (x: number) => b.y0 + b.slope * (x - first);
  const t = up ? THICK.beam : -THICK.beam;
  const half = THICK.stem / 2;
  let d = '';
  const bar = (xa: number, xb: number, level: number) => {
    const off = (up ? 1 : -1) * level * THICK.beamStep;
    const ya = at(xa) + off;
    const yb = at(xb) + off;
    d += `M${r1(xa)} ${r1(ya)}L${r1(xb)} ${r1(yb)}L${r1(xb)} ${r1(yb + t)}L${r1(xa)} ${r1(ya + t)}Z`;
  };
  bar(notes[0].stemX - half, notes[notes.length - 1].stemX + half, 0);
  // Second and third beams join the notes that have them; a note alone at its level gets a
  // short stub toward its neighbour (back toward the group at the end, forward elsewhere).
  for (let level = 1; level < 3; level++) {
    const has = notes.map((n) => (FLAGS[n.code] ?? 1) > level);
    for (let i = 0; i < notes.length; i++) {
      if (!has[i]) continue;
      if (i + 1 < notes.length && has[i + 1]) {
        bar(notes[i].stemX - half, notes[i + 1].stemX + half, level);
        continue;
      }
      if (i > 0 && has[i - 1]) continue;
      const stub = Math.min(SPACE, Math.abs(notes[Math.max(1, i)].stemX - notes[Math.max(1, i) - 1].stemX) / 2);
      if (i > 0) bar(notes[i].stemX - stub, notes[i].stemX + half, level);
      else bar(notes[i].stemX - half, notes[i].stemX + stub, level);
    }
  }
  return `<path class="sf-beam" d="${d}"/>`;
}

function tupletMarkup(t: PlacedTuplet): string {
  const mid = (t.x0 + t.x1) / 2;
  const hook = t.up ? 5 : -5;
  const gap = 9;
  const d = `M${r1(t.x0)} ${r1(t.y + hook)}V${r1(t.y)}H${r1(mid - gap)}M${r1(mid + gap)} ${r1(t.y)}H${r1(t.x1)}V${r1(t.y + hook)}`;
  // The digit (a space and a half high) centred in the bracket's gap.
  const digitW = widthOf(GLYPH.tuplet3);
  return `<g class="sf-tuplet"><path d="${d}" fill="none" stroke="currentColor" stroke-width="${THICK.tupletBracket}"/><text x="${r1(mid - digitW / 2)}" y="${r1(t.y + 7.5)}">${GLYPH.tuplet3}</text></g>`;
}
