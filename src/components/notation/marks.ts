/**
 * Sixfold's verdict marks: a row of small shapes under the staff, one under each note, so a
 * verdict reads by shape and fill as well as by colour (colours live in notation.css):
 * hit a filled disc, early a triangle pointing back, late one pointing ahead, wrong a cross,
 * missed an empty ring. A provisional mark is drawn lighter. The note being played gets a
 * highlighter band behind it, in a colour no verdict uses.
 */
import type { Verdict } from '@shared/engine';
import { svgEl } from './svg';

export interface NoteMark {
  verdict: Verdict;
  settled: boolean;
}

/**
 * Marks that change while a staff is shown (a running take). The staff paints them itself, in
 * the listener, the moment they change: a played note's mark is in the page before the input
 * event's handler returns, with no React render in between.
 */
export interface MarkSource {
  /** Calls `paint` on every change, before any other listener; returns the unsubscribe. */
  subscribePaint(paint: () => void): () => void;
  /** The marks and the current note for this drill (none when the marks belong to another). */
  marksFor(drill: unknown): { marks: ReadonlyMap<number, NoteMark>; current: number | null };
}

/** Where a drawn note is, for its mark and the band behind it. */
export interface NoteGeometry {
  /** the notehead's centre */
  x: number;
  /** the centre of the marks row under its system */
  laneY: number;
  /** the band behind the current note: from the top line of its system to the bottom line */
  top: number;
  bottom: number;
}

export const VERDICTS: Verdict[] = ['hit', 'early', 'late', 'wrong', 'missed'];

/** Draws one verdict's shape centred on (x, y); also used by the legend. */
export function drawVerdictShape(parent: Element, verdict: Verdict, x: number, y: number): void {
  const r = 4.6;
  switch (verdict) {
    case 'hit':
      svgEl(parent, 'circle', { cx: x, cy: y, r, class: 'sf-shape-fill' });
      break;
    case 'early':
      svgEl(parent, 'path', { d: `M${x - r - 1} ${y}L${x + r} ${y - r}L${x + r} ${y + r}Z`, class: 'sf-shape-fill' });
      break;
    case 'late':
      svgEl(parent, 'path', { d: `M${x + r + 1} ${y}L${x - r} ${y - r}L${x - r} ${y + r}Z`, class: 'sf-shape-fill' });
      break;
    case 'wrong':
      svgEl(parent, 'path', {
        d: `M${x - r} ${y - r}L${x + r} ${y + r}M${x + r} ${y - r}L${x - r} ${y + r}`,
        class: 'sf-shape-stroke',
      });
      break;
    default:
      svgEl(parent, 'circle', { cx: x, cy: y, r: r - 0.6, class: 'sf-shape-ring' });
  }
}

/** Parses the class strings the practice pages pass ("sf-mark-late sf-provisional"). */
export function markFromClass(cls: string): NoteMark | null {
  const m = /sf-mark-(hit|early|late|wrong|missed)/.exec(cls);
  if (!m) return null;
  return { verdict: m[1] as Verdict, settled: !/\bsf-provisional\b/.test(cls) };
}

/** Marks and the current-note band on a drawn staff, changed without redrawing the notes. */
export class MarkLayer {
  private readonly shapes = new Map<number, SVGGElement>();
  private readonly applied = new Map<number, string>();
  private readonly band: SVGRectElement;
  private currentIndex: number | null = null;

  constructor(
    svg: SVGSVGElement,
    private readonly notes: SVGElement[],
    private readonly geometry: NoteGeometry[],
    private readonly layer: SVGGElement,
  ) {
    this.band = document.createElementNS('http://www.w3.org/2000/svg', 'rect');
    this.band.setAttribute('class', 'sf-current-band');
    this.band.setAttribute('visibility', 'hidden');
    // Behind everything else drawn.
    svg.insertBefore(this.band, svg.firstChild);
  }

  set(index: number, mark: NoteMark | null): void {
    const el = this.notes[index];
    const geo = this.geometry[index];
    if (!el || !geo) return;
    const key = mark ? `${mark.verdict}:${mark.settled}` : '';
    if (this.applied.get(index) === key) return;
    this.applied.set(index, key);
    el.setAttribute('data-verdict', mark?.verdict ?? '');
    el.setAttribute('data-settled', mark?.settled ? 'true' : 'false');
    for (const v of VERDICTS) el.classList.toggle(`sf-mark-${v}`, mark?.verdict === v);
    el.classList.toggle('sf-provisional', Boolean(mark && !mark.settled));
    this.shapes.get(index)?.remove();
    this.shapes.delete(index);
    if (!mark) return;
    const g = svgEl(this.layer, 'g', {
      class: `sf-mark sf-verdict-${mark.verdict}${mark.settled ? '' : ' sf-provisional'}`,
      'data-mark-for': index,
    });
    drawVerdictShape(g, mark.verdict, geo.x, geo.laneY);
    this.shapes.set(index, g);
  }

  /** Sets every note's mark: those not in the map are cleared. */
  setAll(marks: ReadonlyMap<number, NoteMark>): void {
    for (let i = 0; i < this.notes.length; i++) this.set(i, marks.get(i) ?? null);
  }

  setCurrent(index: number | null): void {
    if (index === this.currentIndex) return;
    if (this.currentIndex !== null) this.notes[this.currentIndex]?.classList.remove('sf-current');
    this.currentIndex = index;
    const geo = index === null ? undefined : this.geometry[index];
    if (index === null || !geo) {
      this.band.setAttribute('visibility', 'hidden');
      return;
    }
    this.notes[index]?.classList.add('sf-current');
    this.band.setAttribute('x', String(geo.x - 9));
    this.band.setAttribute('y', String(geo.top));
    this.band.setAttribute('width', '18');
    this.band.setAttribute('height', String(geo.bottom - geo.top));
    this.band.setAttribute('rx', '4');
    this.band.setAttribute('visibility', 'visible');
  }
}
