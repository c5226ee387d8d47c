import { Chord, Interval, Note, Scale } from 'tonal';
import { describe, expect, it } from 'vitest';
import { EngineError, allPairs, pairsForChord, parseTriad, triadPair } from '../../shared/engine';

describe('parseTriad', () => {
  it.each([
    // spellings against tonal as reference library
    ['F', 'F', 'major', ['F', 'A', 'C']],
    ['Fm', 'F', 'minor', ['F', 'Ab', 'C']],
    ['Fdim', 'F', 'diminished', ['F', 'Ab', 'Cb']],
    ['Faug', 'F', 'augmented', ['F', 'A', 'C#']],
    ['B', 'B', 'major', ['B', 'D#', 'F#']], // B major = B D# F#, never B Eb Gb (tonal as reference library)
    ['Ebm', 'Eb', 'minor', ['Eb', 'Gb', 'Bb']],
    ['C#m', 'C#', 'minor', ['C#', 'E', 'G#']],
  ])('%s', (symbol, root, quality, pcs) => {
    const t = parseTriad(symbol);
    expect(t).toEqual({ symbol, root, quality, pitchClasses: pcs });
    expect(t.pitchClasses).toEqual(Chord.get(symbol).notes); // tonal as reference library
  });

  it('reads tonal aliases and writes Sixfold symbols', () => {
    expect(parseTriad('F+').symbol).toBe('Faug');
    expect(parseTriad('Fo').symbol).toBe('Fdim');
    expect(parseTriad('FM').symbol).toBe('F');
  });

  it.each(['F4', 'F7', 'Fsus4', 'H', '', '  ', 'Fmaj7', 'C5'])('refuses %j with an EngineError', (bad) => {
    expect(() => parseTriad(bad)).toThrow(EngineError);
  });
});

describe('triadPair', () => {
  it('a minor triad with the major triad a whole step below makes F G Ab Bb C Eb', () => {
    // common practice: Fm and Eb make the six-note scale F G Ab Bb C Eb
    const p = triadPair('Fm', 'Eb');
    expect(p.hexatonic).toEqual(['F', 'G', 'Ab', 'Bb', 'C', 'Eb']);
    expect(p.interval).toBe('7m'); // tonal as reference library: F up to Eb is a minor seventh
  });

  it('lists six notes ascending from the first root', () => {
    expect(triadPair('F', 'Eb').hexatonic).toEqual(['F', 'G', 'A', 'Bb', 'C', 'Eb']);
    expect(triadPair('F', 'B').hexatonic).toEqual(['F', 'F#', 'A', 'B', 'C', 'D#']);
    expect(triadPair('F', 'B').interval).toBe('4A'); // tonal as reference library
  });

  it('refuses triads that share a note', () => {
    expect(() => triadPair('C', 'Am')).toThrow(EngineError);
    expect(() => triadPair('C', 'C')).toThrow(EngineError);
    expect(() => triadPair('C', 'X')).toThrow(EngineError);
  });
});

describe('allPairs', () => {
  it('holds every disjoint pair once, roots spelled from the list', () => {
    const pairs = allPairs();
    const roots = ['C', 'Db', 'D', 'Eb', 'E', 'F', 'F#', 'G', 'Ab', 'A', 'Bb', 'B'];
    const keys = new Set<string>();
    for (const p of pairs) {
      expect(roots).toContain(p.a.root);
      expect(roots).toContain(p.b.root);
      expect(roots.indexOf(p.a.root)).toBeLessThan(roots.indexOf(p.b.root));
      expect(new Set(p.hexatonic.map((n) => Note.chroma(n))).size).toBe(6);
      const key = `${p.a.symbol}/${p.b.symbol}`;
      expect(keys.has(key)).toBe(false);
      keys.add(key);
    }
  });

  it('counts 30 major pairs (each major triad avoids 5 others) and 4 augmented triads', () => {
    // common practice: a major triad shares no note with the major triads a half step, a whole step
    // and a tritone away (5 of them), so 12 x 5 / 2 = 30 pairs
    expect(allPairs(['major'])).toHaveLength(30);
    const aug = new Set(
      allPairs(['augmented', 'major'])
        .flatMap((p) => [p.a, p.b])
        .filter((t) => t.quality === 'augmented')
        .map((t) => t.root),
    );
    expect([...aug].sort()).toEqual(['C', 'D', 'Db', 'Eb']);
    expect(allPairs(['major']).some((p) => p.a.symbol === 'Eb' && p.b.symbol === 'F')).toBe(true);
  });
});

describe('pairsForChord', () => {
  it('two major triads a whole step apart fit the dominant seventh on the upper root', () => {
    // common practice: Eb and F fit F7 (F mixolydian holds Eb F G A Bb C)
    const fit = pairsForChord('F7').find((f) => f.pair.a.symbol === 'Eb' && f.pair.b.symbol === 'F');
    expect(fit?.scale).toBe('mixolydian');
    expect(fit?.functions).toEqual(['b7', '1', '9', '3', '11', '5']);
  });

  it('and the minor seventh a fifth above that root', () => {
    // common practice: Eb and F fit Cm7 (C dorian)
    const fit = pairsForChord('Cm7').find((f) => f.pair.a.symbol === 'Eb' && f.pair.b.symbol === 'F');
    expect(fit?.scale).toBe('dorian');
    expect(fit?.functions).toEqual(['b3', '11', '5', '13', 'b7', '1']);
  });

  it('ranks 1-based, each pair once; after the whole-step major pairs, those holding the third and seventh lead', () => {
    const fits = pairsForChord('F7');
    expect(fits.map((f) => f.rank)).toEqual(fits.map((_, i) => i + 1));
    const keys = fits.map((f) => `${f.pair.a.symbol}/${f.pair.b.symbol}`);
    expect(new Set(keys).size).toBe(keys.length);
    let seenWithout = false;
    const plainFits = fits.filter(
      (f) =>
        !f.altered &&
        !(f.pair.a.quality === 'major' && f.pair.b.quality === 'major' && Interval.semitones(f.pair.interval) === 2),
    );
    for (const f of plainFits) {
      const holds = ['A', 'Eb'].every((n) => f.pair.hexatonic.some((h) => Note.chroma(h) === Note.chroma(n)));
      if (!holds) seenWithout = true;
      else expect(seenWithout).toBe(false);
    }
  });

  it.each([
    ['Ebmaj7', 'major'],
    ['G7alt', 'altered'],
    ['Cm7b5', 'locrian #2'],
    ['Cdim7', 'diminished'],
    ['Cmaj7#5', 'lydian augmented'],
    ['CmMaj7', 'melodic minor'],
    ['C7sus4', 'mixolydian'],
    ['Caug', 'whole tone'],
  ])(
    '%s: every pair sits in a scale of its family that holds the chord (tonal as reference library)',
    (chord, firstScale) => {
      const fits = pairsForChord(chord);
      expect(fits.length).toBeGreaterThan(0);
      expect(fits.some((f) => f.scale === firstScale)).toBe(true);
      const root = Chord.get(chord).tonic;
      const chordChroma = Chord.get(chord).notes.map((n) => Note.chroma(n));
      for (const f of fits) {
        const scale = Scale.get(`${root} ${f.scale}`).notes.map((n) => Note.chroma(n));
        for (const c of chordChroma) expect(scale).toContain(c);
        for (const n of f.pair.hexatonic) expect(scale).toContain(Note.chroma(n));
        expect(f.functions).toHaveLength(6);
      }
    },
  );

  it('names chord tones by degree and others as tensions', () => {
    const fit = pairsForChord('Cdim7').find((f) => f.functions.includes('bb7'));
    expect(fit).toBeDefined();
    const c6 = pairsForChord('C6')[0];
    expect(c6.functions).toContain('6');
    expect(pairsForChord('C')[0].functions).toContain('13');
  });

  it.each(['', 'H7', 'C5', 'Qm7'])('refuses %j with an EngineError', (bad) => {
    expect(() => pairsForChord(bad)).toThrow(EngineError);
  });
});
