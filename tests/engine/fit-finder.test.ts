import { Chord, Interval, Note, Scale } from 'tonal';
import { describe, expect, it } from 'vitest';
import { type ChordFit, pairsForChord, ROOT_SPELLINGS } from '../../shared/engine';

const name = (f: ChordFit) => `${f.pair.a.symbol}/${f.pair.b.symbol}`;
const chroma = (n: string) => Note.chroma(n) as number;
const DOUBLE = /##|bb|x/;

/** tonal's answers, read once each (the same triads and scales come up for many chords). */
const memo = <T>(read: (key: string) => T) => {
  const seen = new Map<string, T>();
  return (key: string): T => {
    if (!seen.has(key)) seen.set(key, read(key));
    return seen.get(key) as T;
  };
};
const chordNotes = memo((symbol) => Chord.get(symbol).notes);
const scaleChromas = memo((name) => Scale.get(name).notes.map((n) => Note.chroma(n) as number));

/** The usual scales of a dominant chord, in order of preference (common practice). */
const DOMINANT_SCALES = [
  'mixolydian',
  'lydian dominant',
  'mixolydian b6',
  'half-whole diminished',
  'phrygian dominant',
  'whole tone',
  'altered',
];
const DOMINANT_SYMBOLS = ['7', '9', '13', '7b9', '7#9', '7#11', '7b13', '7#9b13', '7alt'];

/**
 * The chord's tones a scale must hold, as pitch classes: every tone tonal's Chord.get reads in
 * the symbol, except a dominant's perfect fifth, which is free (common practice).
 */
function requiredTones(chord: string): { root: string; chromas: number[]; fifth: number | null } {
  const c = Chord.get(chord);
  const root = c.tonic as string;
  const dominant = c.intervals.includes('3M') && c.intervals.includes('7m');
  const fifth = c.intervals.includes('5P') ? chroma(Note.transpose(root, '5P')) : null;
  const chromas = c.notes.map(chroma).filter((x) => !(dominant && x === fifth));
  return { root, chromas, fifth: dominant ? fifth : null };
}

/**
 * What is wrong with a fit, checked against tonal: its scale (Scale.get on the chord's root) must
 * hold the chord and the pair, and each triad must be spelled as Chord.get spells its symbol.
 */
function tonalProblems(chord: string, fit: ChordFit): string[] {
  const { root, chromas } = requiredTones(chord);
  const scale = scaleChromas(`${root} ${fit.scale}`);
  const problems: string[] = [];
  const where = `${chord} ${name(fit)} (${fit.scale})`;
  if (scale.length < 6) problems.push(`${where}: tonal has no such scale`);
  if (!chromas.every((c) => scale.includes(c))) problems.push(`${where}: the scale misses a chord tone`);
  if (!fit.pair.hexatonic.every((n) => scale.includes(chroma(n))))
    problems.push(`${where}: a note is outside the scale`);
  for (const t of [fit.pair.a, fit.pair.b]) {
    if (t.pitchClasses.join(' ') !== chordNotes(t.symbol).join(' ')) problems.push(`${where}: ${t.symbol} misspelled`);
  }
  return problems;
}

const expectFitsTonal = (chord: string, fit: ChordFit) => expect(tonalProblems(chord, fit)).toEqual([]);

describe('pairsForChord: the pairs players of the trade reach for', () => {
  it.each([
    // Pairs expected near the top (common practice, from memory), spelled as the trade writes them.
    ['Cmaj7#11', 'C/D'], // C lydian: the major triads on the root and the 9th
    ['G7alt', 'Db/Eb'], // G altered: the major triads on the b5 and b6
    ['D7', 'C/D'], // D mixolydian: the triads on the b7 and the root
    ['Am7', 'C/D'], // A dorian: the triads on the b3 and the 11th
    ['Fm7', 'Ab/Bb'], // F dorian
    ['C7#9b13', 'Gb/Ab'], // C altered
    ['F7#9', 'B/Db'], // F altered
  ])('%s offers %s within its first three fits (checked against tonal Scale and Chord)', (chord, pair) => {
    const fits = pairsForChord(chord);
    const fit = fits.find((f) => name(f) === pair);
    expect(fit, `${pair} among ${fits.slice(0, 5).map(name).join(', ')}`).toBeDefined();
    expect(fit?.rank).toBeLessThanOrEqual(3);
    expectFitsTonal(chord, fit as ChordFit);
  });

  it('D7 offers Ab/Bb as an altered fit, below every fit that keeps its fifth', () => {
    const fits = pairsForChord('D7');
    const fit = fits.find((f) => name(f) === 'Ab/Bb') as ChordFit;
    expect(fit).toBeDefined();
    expect(fit.altered).toBe(true);
    expectFitsTonal('D7', fit);
    // tonal: D whole tone and D altered leave out A, D7's perfect fifth
    expect(Scale.get(`D ${fit.scale}`).notes.map(chroma)).not.toContain(chroma('A'));
    const lastPlain = Math.max(...fits.filter((f) => !f.altered).map((f) => f.rank));
    expect(fit.rank).toBeGreaterThan(lastPlain);
  });

  it('every dominant symbol on all 12 roots answers with fits its scales hold (tonal)', () => {
    for (const root of ROOT_SPELLINGS) {
      for (const symbol of DOMINANT_SYMBOLS) {
        const chord = root + symbol;
        const fits = pairsForChord(chord);
        expect(fits.length, chord).toBeGreaterThan(0);
        const { root: tonic, fifth } = requiredTones(chord);
        const problems: string[] = [];
        for (const f of fits) {
          if (!DOMINANT_SCALES.includes(f.scale)) problems.push(`${chord}: ${f.scale} is not a dominant's scale`);
          problems.push(...tonalProblems(chord, f));
          // altered: only a scale without the symbol's perfect fifth holds the pair, so the pair
          // leaves the fifth out and no earlier scale of the table that holds the fifth holds it.
          const scaleHasFifth = fifth !== null && scaleChromas(`${tonic} ${f.scale}`).includes(fifth);
          if (f.altered && (fifth === null || scaleHasFifth)) problems.push(`${chord} ${name(f)}: marked altered`);
          if (!f.altered && fifth !== null && !scaleHasFifth) problems.push(`${chord} ${name(f)}: not marked altered`);
        }
        expect(problems).toEqual([]);
      }
    }
  });

  it('no pair name, triad note or note name holds a double sharp or flat, on any root', () => {
    const symbols = [...DOMINANT_SYMBOLS, 'maj7#11', '', 'm', 'dim', 'aug', '6', 'maj7', 'm7', 'm6', 'm7b5', 'dim7'];
    for (const root of [...ROOT_SPELLINGS, 'Gb', 'C#', 'Cb', 'F#']) {
      for (const symbol of symbols) {
        const doubles = pairsForChord(root + symbol).flatMap((f) =>
          [f.pair.a.symbol, f.pair.b.symbol, ...f.pair.hexatonic, ...f.notes]
            .filter((n) => DOUBLE.test(n))
            .map((n) => `${root + symbol} ${name(f)}: ${n}`),
        );
        expect(doubles).toEqual([]);
      }
    }
  });
});

describe('pairsForChord: names against the chord', () => {
  it('spells chord tones as tonal spells the chord, other notes as the scale on its root', () => {
    // tonal: Chord.get('G7alt').notes = G B D# F A#; Scale.get('G altered') holds Ab and C#
    const g = pairsForChord('G7alt')[0];
    const byFunction = Object.fromEntries(g.functions.map((fn, i) => [fn, g.notes[i]]));
    expect(byFunction).toMatchObject({ '1': 'G', '#5': 'D#', b7: 'F', '#9': 'A#', b9: 'Ab', '#11': 'C#' });
    // D7's root is D (never Ebb), G7's root G (never Abb)
    for (const [chord, root] of [
      ['D7', 'D'],
      ['G7', 'G'],
    ]) {
      for (const f of pairsForChord(chord)) {
        const i = f.functions.indexOf('1');
        if (i >= 0) expect(f.notes[i]).toBe(root);
      }
    }
    // Bbm7b5: tonal spells it Bb Db Fb Ab; its 11th is Eb (Bb locrian), never D#, its root never A#
    for (const f of pairsForChord('Bbm7b5')) {
      expect(f.notes).not.toContain('A#');
      expect(f.notes).not.toContain('D#');
      const i = f.functions.indexOf('b5');
      if (i >= 0) expect(f.notes[i]).toBe('Fb');
    }
  });

  it('says which notes are chord tones and which are tensions', () => {
    // C7#9 = C E G Bb D# (tonal); D# is the #9, a tension, though the symbol names it
    const fit = pairsForChord('C7#9').find((f) => f.notes.includes('D#')) as ChordFit;
    const i = fit.notes.indexOf('D#');
    expect(fit.functions[i]).toBe('#9');
    expect(fit.roles[i]).toBe('tension');
    const e = fit.notes.indexOf('E');
    if (e >= 0) expect(fit.roles[e]).toBe('chord-tone');
    // over a plain triad a seventh is neither: named by its interval
    const c = pairsForChord('C').find((f) => f.functions.includes('7')) as ChordFit;
    expect(c.roles[c.functions.indexOf('7')]).toBe('other');
    for (const f of pairsForChord('Ebmaj7')) {
      f.roles.forEach((role, k) => {
        const inChord = Chord.get('Ebmaj7').notes.map(chroma).includes(chroma(f.notes[k]));
        expect(role === 'chord-tone', `${name(f)} ${f.notes[k]}`).toBe(inChord);
      });
    }
  });

  it('maj7#11 chords use the lydian scale only', () => {
    for (const root of ROOT_SPELLINGS) {
      const fits = pairsForChord(`${root}maj7#11`);
      expect(fits.length).toBeGreaterThan(0);
      expect(new Set(fits.map((f) => f.scale))).toEqual(new Set(['lydian']));
    }
  });
});

describe('pairsForChord: rank keys in order', () => {
  /** Keys 1 to 5 recomputed from tonal's reading of the chord, for comparison with the engine's order. */
  function keys(chord: string, f: ChordFit): number[] {
    const c = Chord.get(chord);
    const root = c.tonic as string;
    const up = (n: string) => (chroma(n) - chroma(root) + 12) % 12;
    const held = new Set(f.pair.hexatonic.map(up));
    const ivls = c.intervals.map((i) => Interval.get(i));
    const named = chord.includes('alt')
      ? [1, 3, 6, 8] // b9, #9, #11, b13
      : ivls.filter((i) => i.num >= 9).map((i) => (i.semitones as number) % 12);
    const sevenths = ivls.filter((i) => i.num === 7);
    const guides = [
      ...ivls.filter((i) => i.num === 3),
      ...(sevenths.length ? sevenths : ivls.filter((i) => i.num === 6)),
    ];
    const q = [f.pair.a.quality, f.pair.b.quality];
    const step = (chroma(f.pair.b.root) - chroma(f.pair.a.root) + 12) % 12;
    return [
      -named.filter((st) => held.has(st)).length,
      named.length === 0 && f.altered ? 1 : 0,
      q.every((x) => x === 'major') && (step === 2 || step === 10) ? 0 : 1,
      -guides.filter((i) => held.has((i.semitones as number) % 12)).length,
      q.every((x) => x === 'major' || x === 'minor') ? 0 : 1,
    ];
  }

  it.each(['D7', 'G7alt', 'C7#9b13', 'F7#9', 'Cmaj7#11', 'Am7', 'Ebmaj7', 'Bbm7b5', 'C13', 'Eb7b9'])(
    '%s: named tensions, plain before altered, whole-step majors, guide tones, major and minor',
    (chord) => {
      const fits = pairsForChord(chord);
      expect(fits.map((f) => f.rank)).toEqual(fits.map((_, i) => i + 1));
      expect(new Set(fits.map(name)).size).toBe(fits.length);
      for (let i = 1; i < fits.length; i++) {
        const a = keys(chord, fits[i - 1]);
        const b = keys(chord, fits[i]);
        const k = a.findIndex((v, j) => v !== b[j]);
        if (k >= 0) expect(a[k], `${name(fits[i - 1])} before ${name(fits[i])}`).toBeLessThan(b[k]);
      }
    },
  );
});
