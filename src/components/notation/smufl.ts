/**
 * The music font's glyphs by their SMuFL code points (Standard Music Font Layout 1.4), and the
 * few sizes the engraver needs, in staff spaces, from the Bravura font's own metadata file
 * (glyphAdvanceWidths, engravingDefaults). The staff draws at 10 px a staff space, so the font
 * is set at 40 px: one em is four staff spaces in SMuFL.
 */

/** px between two staff lines */
export const SPACE = 10;
/** the music font's size: one em is four staff spaces */
export const MUSIC_FONT_PX = 4 * SPACE;

export const GLYPH = {
  noteheadBlack: '\uE0A4',
  noteheadHalf: '\uE0A3',
  noteheadWhole: '\uE0A2',
  accidentalFlat: '\uE260',
  accidentalNatural: '\uE261',
  accidentalSharp: '\uE262',
  gClef: '\uE050',
  gClef8vb: '\uE052',
  fClef: '\uE062',
  flag8thUp: '\uE240',
  flag8thDown: '\uE241',
  flag16thUp: '\uE242',
  flag16thDown: '\uE243',
  flag32ndUp: '\uE244',
  flag32ndDown: '\uE245',
  restWhole: '\uE4E3',
  restHalf: '\uE4E4',
  restQuarter: '\uE4E5',
  rest8th: '\uE4E6',
  rest16th: '\uE4E7',
  rest32nd: '\uE4E8',
  augmentationDot: '\uE1E7',
  brace: '\uE000',
  tuplet3: '\uE883',
} as const;

/** A time signature digit (timeSig0..timeSig9). */
export const timeSigDigit = (d: number): string => String.fromCodePoint(0xe080 + d);

/** Advance widths in staff spaces (Bravura's metadata). */
export const WIDTH: Record<string, number> = {
  [GLYPH.noteheadBlack]: 1.18,
  [GLYPH.noteheadHalf]: 1.18,
  [GLYPH.noteheadWhole]: 1.688,
  [GLYPH.accidentalFlat]: 0.904,
  [GLYPH.accidentalNatural]: 0.672,
  [GLYPH.accidentalSharp]: 0.996,
  [GLYPH.gClef]: 2.684,
  [GLYPH.gClef8vb]: 2.656,
  [GLYPH.fClef]: 2.736,
  [GLYPH.restWhole]: 1.132,
  [GLYPH.restHalf]: 1.132,
  [GLYPH.restQuarter]: 1.08,
  [GLYPH.rest8th]: 1.0,
  [GLYPH.rest16th]: 1.28,
  [GLYPH.rest32nd]: 1.452,
  [GLYPH.augmentationDot]: 0.4,
  [GLYPH.tuplet3]: 1.184,
};
const TIME_SIG_WIDTH = [1.88, 1.336, 1.784, 1.684, 1.88, 1.612, 1.736, 1.764, 1.744, 1.736];

/** px width of a glyph at the music font's size. */
export const widthOf = (glyph: string): number => (WIDTH[glyph] ?? 1) * SPACE;

/** px width of a time signature's number. */
export const timeSigWidth = (n: number): number =>
  [...String(n)].reduce((w, d) => w + (TIME_SIG_WIDTH[Number(d)] ?? 1.8), 0) * SPACE;

/** Line thicknesses in px (Bravura's engraving defaults, rounded for the screen). */
export const THICK = {
  staffLine: 1,
  stem: 1.5,
  ledger: 1.6,
  beam: 5,
  /** from one beam to the next: thickness plus Bravura's beam spacing */
  beamStep: 7.5,
  thinBarline: 1,
  thickBarline: 5,
  tupletBracket: 1,
} as const;
