import { readFileSync } from 'node:fs';
import {
  type Color,
  differenceCiede2000,
  filterDeficiencyDeuter,
  filterDeficiencyProt,
  filterDeficiencyTrit,
  parse,
  wcagContrast,
} from 'culori';
import { describe, expect, it } from 'vitest';

/**
 * The verdict marks' colours, read from the stylesheet the staff uses, checked against both
 * themes' page colours: every mark stands out from the page (WCAG 2.1 non-text contrast, 3:1),
 * and no two verdicts, nor a verdict and the current-note band, look alike to a reader with
 * protanopia, deuteranopia or tritanopia (culori's Machado 2009 simulation, CIEDE2000 distance).
 */
const css = readFileSync(new URL('../../src/components/notation/notation.css', import.meta.url), 'utf8');
const themeCss = readFileSync(new URL('../../src/index.css', import.meta.url), 'utf8');

function block(source: string, selector: string): string {
  const start = source.indexOf(`${selector} {`);
  if (start < 0) throw new Error(`no ${selector} block`);
  return source.slice(start, source.indexOf('}', start));
}

function vars(body: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const m of body.matchAll(/--([\w-]+):\s*([^;]+);/g)) out[m[1]] = m[2].trim();
  return out;
}

/** "20 27 43" (the theme's rgb channels) as a colour. */
const channels = (v: string) => parse(`rgb(${v.split(/\s+/).join(',')})`) as Color;

const VERDICTS = ['hit', 'early', 'late', 'wrong', 'missed'] as const;
const light = { ...vars(block(css, '.sf-staff')) };
const dark = { ...light, ...vars(block(css, '.dark .sf-staff')) };
const themes = {
  light: { marks: light, page: vars(block(themeCss, ':root')) },
  dark: { marks: dark, page: vars(block(themeCss, '.dark')) },
};

/** A mark's colour in a theme; "rgb(var(--sf-text))" is the theme's text colour. */
function colourOf(theme: keyof typeof themes, name: string): Color {
  const raw = themes[theme].marks[name];
  if (raw === 'rgb(var(--sf-text))') return channels(themes[theme].page['sf-text']);
  const c = parse(raw);
  if (!c) throw new Error(`${name} in ${theme} is not a colour: ${raw}`);
  return c;
}

/** A translucent colour as it shows over the page. */
function over(c: Color, page: Color): Color {
  const a = c.alpha ?? 1;
  const p = page as { r: number; g: number; b: number };
  const f = c as { r: number; g: number; b: number };
  return { mode: 'rgb', r: f.r * a + p.r * (1 - a), g: f.g * a + p.g * (1 - a), b: f.b * a + p.b * (1 - a) };
}

const visions: Array<[string, (c: Color) => Color]> = [
  ['typical vision', (c) => c],
  ['protanopia', filterDeficiencyProt(1)],
  ['deuteranopia', filterDeficiencyDeuter(1)],
  ['tritanopia', filterDeficiencyTrit(1)],
];
const distance = differenceCiede2000();
/** CIEDE2000 of 10 or more reads as a different colour at a glance (common practice). */
const APART = 10;

describe('verdict mark colours', () => {
  for (const theme of ['light', 'dark'] as const) {
    const surface = channels(themes[theme].page['sf-surface']);
    const raised = channels(themes[theme].page['sf-raised']);

    it(`stand out from the ${theme} page by at least 3:1`, () => {
      for (const v of VERDICTS) {
        const c = colourOf(theme, `sf-verdict-${v}`);
        expect(wcagContrast(c, surface), `${v} on the surface`).toBeGreaterThanOrEqual(3);
        expect(wcagContrast(c, raised), `${v} on a card`).toBeGreaterThanOrEqual(3);
      }
    });

    it(`stay apart from each other and from the current-note band in ${theme}, for colour-blind readers too`, () => {
      const band = over(colourOf(theme, 'sf-current'), raised);
      const entries: Array<[string, Color]> = [
        ...VERDICTS.map((v) => [v, colourOf(theme, `sf-verdict-${v}`)] as [string, Color]),
        ['current-note band', band],
      ];
      for (const [vision, see] of visions) {
        for (let i = 0; i < entries.length; i++) {
          for (let j = i + 1; j < entries.length; j++) {
            const d = distance(see(entries[i][1]), see(entries[j][1]));
            expect(d, `${entries[i][0]} vs ${entries[j][0]} (${vision})`).toBeGreaterThanOrEqual(APART);
          }
        }
      }
    });
  }
});
