/**
 * What is drawn in lanes beside the staff rather than on it: ottava lines, the a/b tag over
 * each cell, and chord symbols. Plain SVG, placed from the geometry of the drawn notes.
 */
import type { Ottava } from '@shared/engine';
import { svgEl } from './svg';

export interface Span {
  x0: number;
  x1: number;
}

/** The sign at the start of an ottava line (common practice): one octave 8va/8vb, two 15ma/15mb. */
const OTTAVA_LABEL: Record<Exclude<Ottava, 0>, string> = { 8: '8va', [-8]: '8vb', 15: '15ma', [-15]: '15mb' };

/**
 * An ottava line: "8va", "8vb", "15ma" or "15mb" at the start, a dashed line to the last note
 * under it, and a short hook toward the staff where the passage ends (none when it runs on to
 * the next line).
 */
export function drawOttava(parent: Element, span: Span, y: number, kind: Exclude<Ottava, 0>, closes: boolean): void {
  const label = OTTAVA_LABEL[kind];
  const g = svgEl(parent, 'g', { class: 'sf-ottava', 'data-ottava': label });
  svgEl(g, 'text', { x: span.x0, y: y + 4, class: 'sf-ottava-text' }, label);
  // the two-digit sign is wider: the dashes start after it
  const lineStart = span.x0 + (label.length > 3 ? 28 : 22);
  const end = Math.max(lineStart + 6, span.x1);
  svgEl(g, 'line', { x1: lineStart, y1: y, x2: end, y2: y, class: 'sf-ottava-line' });
  if (closes) svgEl(g, 'line', { x1: end, y1: y, x2: end, y2: y + (kind > 0 ? 7 : -7), class: 'sf-ottava-hook' });
}

/**
 * The triad a cell comes from: a small boxed letter over the cell's first note and a rule in
 * the triad's colour over the rest of it, in a lane above everything on the staff, so it reads
 * as a label, never as an accidental, a note name or a tuplet number.
 */
export function drawCellTag(parent: Element, span: Span, y: number, triad: 'a' | 'b', cell: number): void {
  const g = svgEl(parent, 'g', { class: `sf-cell sf-triad-${triad}`, 'data-cell': cell });
  const box = 12;
  const x = span.x0 - 1;
  svgEl(g, 'rect', { x, y: y - box / 2, width: box, height: box, rx: 2.5, class: 'sf-cell-box' });
  svgEl(g, 'text', { x: x + box / 2, y: y + 3.6, 'text-anchor': 'middle', class: 'sf-cell-letter' }, triad);
  if (span.x1 > x + box + 4) {
    svgEl(g, 'line', { x1: x + box + 2, y1: y, x2: span.x1, y2: y, class: 'sf-cell-rule' });
    svgEl(g, 'line', { x1: span.x1, y1: y, x2: span.x1, y2: y + 4, class: 'sf-cell-rule' });
  }
}

/** A chord symbol over the start of a measure. */
export function drawChordSymbol(parent: Element, x: number, y: number, symbol: string): void {
  svgEl(parent, 'text', { x, y, class: 'sf-chord' }, symbol);
}
