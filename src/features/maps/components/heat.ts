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
  return { background: interpolateCividis(1 - t), color: t > 0.45 ? '#ffffff' : '#111111' };
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
