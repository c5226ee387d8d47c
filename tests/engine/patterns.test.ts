import { Interval, Note } from 'tonal';
import { describe, expect, it } from 'vitest';
import {
  type DrillNote,
  EngineError,
  type PatternDef,
  generateDrill,
  inAllKeys,
  sliceDrill,
} from '../../shared/engine';

const names = (notes: DrillNote[]) => notes.map((n) => n.name);

describe('worked examples of the engine contract', () => {
  it('weave, F/Eb, start F4 = 65, up', () => {
    const d = generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up', start: 65 });
    expect(names(d.notes.slice(0, 18))).toEqual(
      'F4 A4 C5 Eb5 Bb4 G4 A4 C5 F5 G5 Eb5 Bb4 C5 F5 A5 Bb5 G5 Eb5'.split(' '),
    );
    expect(d.notes.slice(0, 6).map((n) => n.source)).toEqual(['a', 'a', 'a', 'b', 'b', 'b']);
    expect(d.notes.slice(0, 6).map((n) => n.cell)).toEqual([0, 0, 0, 1, 1, 1]);
    // triplet eighths: three notes per quarter-note beat
    expect(d.notes[3].beat).toBe(1);
    expect(d.notes[1].duration).toBeCloseTo(1 / 3);
  });

  it('four-three, F/B, start A3 = 57, up: the second group of seven starts on the "and" of four', () => {
    const d = generateDrill({ pair: ['F', 'B'], pattern: 'four-three', direction: 'up', start: 57 });
    expect(names(d.notes.slice(0, 18))).toEqual('A3 C4 F4 A4 F#4 D#4 B3 C4 F4 A4 C5 B4 F#4 D#4 F4 A4 C5 F5'.split(' '));
    // common practice: in eighths a cycle of four notes and three lasts seven eighths, so the
    // second cycle starts on the "and" of beat four
    const second = d.notes[7];
    expect(second).toMatchObject({ beat: 3.5, measure: 1, beatInMeasure: 4.5, cell: 2, source: 'a' });
  });
});

describe('MIDI numbers and names', () => {
  it('names every note at concert pitch, middle C = 60 and A4 = 69', () => {
    // MIDI 1.0: note 60 is middle C (C4), note 69 is A4 (440 Hz)
    expect(Note.midi('C4')).toBe(60);
    expect(Note.midi('A4')).toBe(69);
    const d = generateDrill({ pair: ['F', 'B'], pattern: 'four-three', direction: 'up', start: 57 });
    expect(d.notes[0]).toMatchObject({ midi: 57, name: 'A3' });
    expect(d.notes[1]).toMatchObject({ midi: 60, name: 'C4' });
  });

  it('spells a note with the octave that makes it sound (Cb4 is 59)', () => {
    const d = generateDrill({
      pair: ['Fdim', 'D'],
      pattern: 'stack',
      direction: 'up',
      start: 53,
      range: { low: 50, high: 80 },
    });
    const cb = d.notes.find((n) => n.name.startsWith('Cb'));
    expect(cb).toBeDefined();
    expect(Note.midi(cb!.name)).toBe(cb!.midi); // tonal as reference library
  });
});

describe('presets', () => {
  // the piano's whole compass: these examples climb past C6, the top of its default drill range
  const base = {
    pair: ['F', 'Eb'] as [string, string],
    direction: 'up' as const,
    start: 65,
    range: { low: 21, high: 108 },
  };
  it.each([
    ['stack', 'F4 A4 C5 Eb5 G5 Bb5 C6 F6 A6'],
    ['weave-four', 'F4 A4 C5 F5 G5 Eb5 Bb4 G4 A4 C5 F5 A5'],
    ['leap-back', 'F4 C5 A4 F4 F4'],
    ['scale-steps', 'F4 G4 A4 C5 Bb4 A4 G4 F4 G4 A4 Bb4 Eb5'],
    ['scale-steps-triplet', 'F4 G4 A4 C5 Bb4 A4 G4 A4 Bb4 Eb5 C5 Bb4'],
  ] as const)('%s', (pattern, expected) => {
    const d = generateDrill({ ...base, pattern });
    const want = expected.split(' ');
    if (pattern === 'leap-back') {
      // a: F4 C5 A4 F4; b: the root of Eb closest to F4 (Eb4, below; F4-Eb4 = 2 < 10) the same shape
      expect(names(d.notes.slice(0, 8))).toEqual('F4 C5 A4 F4 Eb4 Bb4 G4 Eb4'.split(' '));
      // then a moves up one tone: A4 F5 C5 A4, b from its third closest to A4 (G4)
      expect(names(d.notes.slice(8, 16))).toEqual('A4 F5 C5 A4 G4 Eb5 Bb4 G4'.split(' '));
    } else {
      expect(names(d.notes.slice(0, want.length))).toEqual(want);
    }
  });

  it('mirrors the pattern going down', () => {
    const d = generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'down', start: 77 });
    // a down from F5, then b up entering on Eb's closest tone below A4 (G4), then a down
    // entering on F's closest tone below Eb5 (C5)
    expect(names(d.notes.slice(0, 9))).toEqual('F5 C5 A4 G4 Bb4 Eb5 C5 A4 F4'.split(' '));
  });

  // The up-down rule changed: the descent no longer drops a repeated top note (that put every
  // descending cell across two triads, off the beat); it enters on the next a tone below instead.
  it('up-down enters the descent on the next a tone below when the top was the last note, dropping nothing', () => {
    const d = generateDrill({
      pair: ['F', 'Eb'],
      pattern: 'stack',
      direction: 'up-down',
      range: { low: 53, high: 84 },
    });
    // up: F3 A3 C4 | Eb4 G4 Bb4 | C5 F5 A5 (top A5 is F's and was played last), then down from
    // F5: F5 C5 A4 | G4 Eb4 Bb3; the next a cell (A3 F3 C3) would leave the range
    expect(names(d.notes)).toEqual('F3 A3 C4 Eb4 G4 Bb4 C5 F5 A5 F5 C5 A4 G4 Eb4 Bb3'.split(' '));
    // every cell whole (three triplet eighths) and on the beat
    for (let c = 0; c <= d.notes[d.notes.length - 1].cell; c++) {
      const cell = d.notes.filter((n) => n.cell === c);
      expect(cell).toHaveLength(3);
      expect(Number.isInteger(cell[0].beat)).toBe(true);
      expect(new Set(cell.map((n) => n.source)).size).toBe(1);
    }
  });

  it('up-down enters on the highest a tone at or below the top when the top was not the last note', () => {
    const d = generateDrill({
      pair: ['F', 'Eb'],
      pattern: 'weave',
      direction: 'up-down',
      range: { low: 53, high: 75 },
    });
    // up ends F4 A4 C5 | Eb5 Bb4 G4 (A4 C5 F5 would pass Eb5); the top, Eb5, is not F's, so
    // the descent enters on C5, F's highest tone at or below it
    expect(names(d.notes.slice(18, 27))).toEqual('F4 A4 C5 Eb5 Bb4 G4 C5 A4 F4'.split(' '));
    expect(d.notes[24]).toMatchObject({ source: 'a', cell: 8, beat: 8 });
  });

  it('fills the spec with its defaults', () => {
    const d = generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up' });
    // the default range is now the piano's drill range, C3-C6, not its whole compass
    expect(d.spec).toMatchObject({ instrument: 'piano', tempo: 120, meter: [4, 4], range: { low: 48, high: 84 } });
    // the lowest tone of F from which an a cell and a b cell fit: C3 (48), then
    // C3 F3 A3 | Bb3 G3 Eb3
    expect(d.spec.start).toBe(48);
    expect(names(d.notes.slice(0, 6))).toEqual('C3 F3 A3 Bb3 G3 Eb3'.split(' '));
  });

  it('moves a start that is not a tone of a to the next one in the drill direction', () => {
    expect(generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up', start: 66 }).notes[0].name).toBe('A4');
    expect(generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'down', start: 66 }).notes[0].name).toBe(
      'F4',
    );
  });
});

describe('meters and subdivisions', () => {
  it.each([
    [[3, 4], 'eighth', 7, 1.5, 2],
    [[5, 4], 'eighth', 9, 5.5, 1],
    [[6, 8], 'eighth', 7, 2, 2],
    [[7, 8], 'eighth', 7, 1, 2],
    [[4, 4], 'sixteenth', 5, 2.25, 1],
  ] as const)(
    '%j in %s: note %i falls on beat %d of measure %i',
    (meter, subdivision, index, beatInMeasure, measure) => {
      const pattern: PatternDef = { name: 'line', subdivision, source: 'scale', degrees: [0, 1, 2, 3], step: 1 };
      const d = generateDrill({ pair: ['C', 'D'], pattern, direction: 'up', start: 48, meter: [...meter] });
      expect(d.notes[index]).toMatchObject({ beatInMeasure, measure });
    },
  );

  it('counts measures to hold the last note', () => {
    const d = generateDrill({ pair: ['F', 'B'], pattern: 'four-three', direction: 'up', start: 57, meter: [7, 8] });
    const end = d.notes[d.notes.length - 1].beat + 0.5;
    expect(d.measures).toBe(Math.ceil(end / 3.5));
  });
});

describe('custom patterns', () => {
  it('runs a user-defined triad pattern with leaps', () => {
    const pattern: PatternDef = {
      name: 'leaps',
      subdivision: 'sixteenth',
      source: 'triads',
      cells: [
        { triad: 'a', notes: 3, shape: 'leap', motion: 'up', entry: 'start' },
        { triad: 'b', notes: 3, shape: 'line', motion: 'up', entry: 'above' },
      ],
    };
    // the piano's whole compass: the ninth note climbs past C6, the default drill range's top
    const d = generateDrill({ pair: ['F', 'Eb'], pattern, direction: 'up', start: 65, range: { low: 21, high: 108 } });
    expect(names(d.notes.slice(0, 9))).toEqual('F4 C5 A4 Bb4 Eb5 G5 A5 F6 C6'.split(' '));
    expect(d.notes[4].beat).toBe(1);
  });

  it('ends after one cycle when it would repeat without moving', () => {
    const pattern: PatternDef = {
      name: 'rock',
      subdivision: 'eighth',
      source: 'triads',
      cells: [
        { triad: 'a', notes: 3, shape: 'line', motion: 'up', entry: 'same-position' },
        { triad: 'b', notes: 3, shape: 'line', motion: 'down', entry: 'same-position' },
      ],
    };
    const d = generateDrill({ pair: ['C', 'D'], pattern, direction: 'up', start: 60 });
    expect(d.notes.length).toBe(6);
    const still: PatternDef = { name: 'still', subdivision: 'eighth', source: 'scale', degrees: [0, 1, 0], step: 0 };
    expect(generateDrill({ pair: ['C', 'D'], pattern: still, direction: 'up', start: 60 }).notes).toHaveLength(3);
  });
});

describe('errors a player can read', () => {
  it.each([
    [{ pair: ['C', 'E'], pattern: 'weave', direction: 'up' }],
    [{ pair: ['C', 'D'], pattern: 'wave', direction: 'up' }],
    [{ pair: ['C', 'D'], pattern: 'weave', direction: 'sideways' }],
    [{ pair: ['C', 'D'], pattern: 'weave', direction: 'up', instrument: 'kazoo' }],
    [{ pair: ['C', 'D'], pattern: 'weave', direction: 'up', range: { low: 60, high: 62 } }],
    [{ pair: ['C', 'D'], pattern: 'weave', direction: 'up', range: { low: 70, high: 60 } }],
    [{ pair: ['C', 'D'], pattern: 'weave', direction: 'up', start: 127 }],
    [{ pair: ['C', 'D'], pattern: 'weave', direction: 'up', tempo: 0 }],
    [{ pair: ['C', 'D'], pattern: 'weave', direction: 'up', meter: [4, 3] }],
  ])('%j', (spec) => {
    expect(() => generateDrill(spec as never)).toThrow(EngineError);
  });
});

describe('sliceDrill', () => {
  it('keeps measure numbers and re-bases beats', () => {
    const d = generateDrill({ pair: ['F', 'B'], pattern: 'four-three', direction: 'up', start: 57 });
    const s = sliceDrill(d, 2, 3);
    expect(s.measures).toBe(2);
    expect(s.notes[0]).toMatchObject({ beat: 0, measure: 2, beatInMeasure: 1 });
    expect(s.notes.every((n) => n.measure >= 2 && n.measure <= 3)).toBe(true);
    expect(s.notes).toHaveLength(d.notes.filter((n) => n.measure === 2 || n.measure === 3).length);
    expect(() => sliceDrill(d, 3, 2)).toThrow(EngineError);
    expect(() => sliceDrill(d, 0, 1)).toThrow(EngineError);
  });
});

describe('inAllKeys', () => {
  // The moved pair is spelled as one unit now (it used to take each root from C Db D Eb E F F#
  // G Ab A Bb B triad by triad): F/Eb a minor sixth up is C#/B, since Db/Cb would put Cb among
  // the roots; the chord keeps its interval to a's root, so F7 moves to C#7.
  it.each([
    ['chromatic', 'F F# G Ab A Bb B C C# D Eb E'],
    ['fourths', 'F Bb Eb Ab C# F# B E A D G C'],
    ['fifths', 'F C G D A E B F# C# Ab Eb Bb'],
  ] as const)('%s', (order, roots) => {
    const drills = inAllKeys({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up', start: 65, chord: 'F7' }, order);
    expect(drills).toHaveLength(12);
    const expectedRoots = roots.split(' ');
    expect(drills.map((d) => d.spec.pair[0])).toEqual(expectedRoots);
    expect(drills.map((d) => d.spec.chord)).toEqual(expectedRoots.map((r) => `${r}7`));
    // b stays a whole step below a (tonal: the interval keeps its name, a major second)
    for (const d of drills) expect(Interval.distance(d.spec.pair[1], d.spec.pair[0])).toBe('2M');
    // the start moves with the key, then by octaves into the range
    drills.forEach((d) => {
      expect(Note.chroma(d.notes[0].name)).toBe(Note.chroma(d.spec.pair[0]));
      expect(Math.abs(d.spec.start - 65)).toBeLessThan(12);
    });
  });

  it('spells each moved pair as a unit and keeps the names typed for its own key', () => {
    const drills = inAllKeys({ pair: ['Fm', 'Eb'], pattern: 'scale-steps', direction: 'up' });
    expect(drills.map((d) => d.spec.pair.join('/'))).toEqual(
      'Fm/Eb F#m/E Gm/F G#m/F# Am/G Bbm/Ab Bm/A Cm/Bb C#m/B Dm/C Ebm/Db Em/D'.split(' '),
    );
    // the examples: Ebdim and F#aug never come out as Eb Gb Bbb or F# A# C##
    const dim = inAllKeys({ pair: ['Cdim', 'Db'], pattern: 'stack', direction: 'up' });
    expect(dim[3].spec.pair).toEqual(['D#dim', 'E']);
    const aug = inAllKeys({ pair: ['Caug', 'D'], pattern: 'stack', direction: 'up' });
    expect(aug[6].spec.pair).toEqual(['Gbaug', 'Ab']);
    // as typed for the drill's own key, even where the rule would respell it
    expect(inAllKeys({ pair: ['Gb', 'Fb'], pattern: 'stack', direction: 'up' })[0].spec.pair).toEqual(['Gb', 'Fb']);
  });
});

describe('a preset that comes back to where it began', () => {
  it('ends after one cycle instead of repeating itself', () => {
    // weave on Cdim/E: after the first cycle each a cell re-enters on C4 and the b cell falls
    // back to B3, so the drill would go round in place for ever.
    const d = generateDrill({ pair: ['Cdim', 'E'], pattern: 'weave', direction: 'up', range: { low: 48, high: 68 } });
    expect(d.notes.map((n) => n.name)).toEqual([
      'Eb3',
      'Gb3',
      'C4',
      'E4',
      'B3',
      'G#3',
      'C4',
      'Eb4',
      'Gb4',
      'G#4',
      'E4',
      'B3',
    ]);
  });
});
