import { interpolateCividis } from 'd3-scale-chromatic';

/** Error rates at or above this read as the darkest cell. */
export const RATE_CEILING = 0.4;
export const HEAT_STEPS = 8;

/**
 * Cividis (colour-blind safe, readable in grey): few errors pale yellow, many errors deep blue.
 * `t` is 0 for no errors, 1 at the ceiling.
 */
export function heatColour(rate: number): { background: string; color: string } {
  const t = Math.min(1, rate / RATE_CEILING);
  const background = interpolateCividis(1 - t);
  return { background, color: textOn(background) };
}

/** WCAG 2 relative luminance of an "rgb(r, g, b)" colour. */
function luminance(rgb: string): number {
  const [r, g, b] = (rgb.match(/\d+/g) ?? ['0', '0', '0']).slice(0, 3).map((v) => {
    const c = Number(v) / 255;
    return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** Near-black or white, whichever stands out more against the cell (WCAG 2 contrast ratio). */
export function textOn(background: string): string {
  const l = luminance(background);
  return (l + 0.05) / 0.05 >= 1.05 / (l + 0.05) ? '#111111' : '#ffffff';
}

export const heatStep = (rate: number) =>
  Math.min(HEAT_STEPS - 1, Math.floor(Math.min(1, rate / RATE_CEILING) * HEAT_STEPS));

/** Classes sf-heat-0..7 for SVG fills (the range diagram takes classes, not colours). */
export const HEAT_CSS = Array.from(
  { length: HEAT_STEPS },
  (_, i) => `.sf-heat-${i}{fill:${interpolateCividis(1 - (i + 0.5) / HEAT_STEPS)}}`,
).join('\n');

export const pct = (rate: number) => `${Math.round(rate * 100)}%`;
export const cellWords = (what: string, c: { notes: number; errors: number; rate: number }) =>
  `${what}: ${pct(c.rate)} not hit (${c.errors} of ${c.notes} notes)`;

/** Keys with no notes yet: hatched, so they stand apart from every step of the scale. */
export const NO_DATA_CSS = `.sf-nodata{fill:url(#sf-nodata-hatch)}`;
