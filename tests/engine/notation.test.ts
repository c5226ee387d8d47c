import fc from 'fast-check';
import { Note } from 'tonal';
import { describe, expect, it } from 'vitest';
import {
  type Drill,
  type DrillNote,
  type DrillSpec,
  EngineError,
  type InstrumentId,
  type Meter,
  type NotatedEvent,
  type Notation,
  type PatternId,
  allPairs,
  drillToMidi,
  generateDrill,
  instruments,
  midiToPlayed,
  notate,
  sliceDrill,
} from '../../shared/engine';

const LETTERS = 'CDEFGAB';
const stepOf = (name: string) => {
  const n = Note.get(name);
  return (n.oct ?? 4) * 7 + LETTERS.indexOf(n.letter);
};
// common practice: the treble staff's lines run E4 to F5, the bass staff's G2 to A3; a note in
// the space just past a ledger line needs only that line
const STAFF_LINES = {
  treble: [stepOf('E4'), stepOf('F5')],
  'treble-8vb': [stepOf('E4'), stepOf('F5')],
  bass: [stepOf('G2'), stepOf('A3')],
};
function ledgerLines(step: number, clef: keyof typeof STAFF_LINES): number {
  const [bottom, top] = STAFF_LINES[clef];
  if (step > top) return Math.floor((step - top) / 2);
  if (step < bottom) return Math.floor((bottom - step) / 2);
  return 0;
}
// common practice: an 8va line prints the notes under it an octave lower than written, a 15ma
// line two octaves lower; 8vb and 15mb print them higher
const SHIFT_STEPS: Record<NotatedEvent['ottava'], number> = { 0: 0, 8: 7, [-8]: -7, 15: 14, [-15]: -14 };
const printedStep = (e: NotatedEvent) => stepOf(e.written!) - SHIFT_STEPS[e.ottava];

/** A hand-made drill of eighths (or any length) with the given concert names, for exact cases. */
function handDrill(
  names: (string | null)[],
  opts: { meter?: Meter; length?: number; instrument?: InstrumentId } = {},
): Drill {
  const meter = opts.meter ?? [4, 4];
  const length = opts.length ?? 0.5;
  const bar = (meter[0] * 4) / meter[1];
  const notes: DrillNote[] = [];
  names.forEach((name, i) => {
    if (name === null) return;
    const beat = i * length;
    const measure = Math.floor(beat / bar + 1e-9) + 1;
    notes.push({
      midi: Note.midi(name)!,
      name,
      written: name,
      beat,
      duration: length,
      measure,
      beatInMeasure: ((beat - (measure - 1) * bar) * meter[1]) / 4 + 1,
      source: 'a',
      cell: Math.floor(i / 3),
    });
  });
  const end = names.length * length;
  return {
    spec: {
      pair: ['F', 'Eb'],
      pattern: 'weave-four',
      direction: 'up',
      range: { low: 0, high: 127 },
      start: notes[0]?.midi ?? 60,
      instrument: opts.instrument ?? 'flute',
      tempo: 120,
      meter,
    },
    notes,
    measures: Math.max(1, Math.ceil(end / bar - 1e-9)),
  };
}

const staffEvents = (n: Notation, measure: number, staff = 0) =>
  n.measures[measure].events.filter((e) => e.staff === staff).sort((x, y) => x.start - y.start);
const show = (events: NotatedEvent[]) =>
  events.map(
    (e) =>
      `${e.kind === 'rest' ? 'r' : e.written}${e.accidental ?? ''}@${+e.start.toFixed(3)}/${+e.duration.toFixed(3)}`,
  );

describe('staves and clefs', () => {
  it.each([
    ['piano', ['treble', 'bass']],
    ['trombone', ['bass']],
    ['guitar', ['treble-8vb']],
    ['alto-sax', ['treble']],
    ['wind-controller', ['treble']],
  ] as const)('%s reads %j', (instrument, staves) => {
    const n = notate(generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up', instrument }));
    expect(n.staves).toEqual(staves);
  });

  it('puts piano notes below middle C on the bass staff (common practice for a grand staff)', () => {
    const drill = generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up-down' });
    const events = notate(drill).measures.flatMap((m) => m.events.filter((e) => e.kind === 'note'));
    expect(events).toHaveLength(drill.notes.length);
    for (const e of events) expect(e.staff).toBe(drill.notes[e.noteIndex!].midi < 60 ? 1 : 0);
  });

  it("the instruments' default drill ranges need no more than four ledger lines", () => {
    for (const [id, inst] of Object.entries(instruments)) {
      const clefs = inst.clef === 'grand' ? (['treble', 'bass'] as const) : ([inst.clef] as const);
      for (const concert of [inst.drillRange.low, inst.drillRange.high]) {
        const written = Note.fromMidi(concert - inst.transposition);
        const clef = clefs.length === 2 ? (concert < 60 ? 'bass' : 'treble') : clefs[0];
        expect(ledgerLines(stepOf(written), clef), `${id} ${written}`).toBeLessThanOrEqual(4);
      }
    }
    // the piano drills C3-C6 (concert), the wind controller an alto saxophone's sounding range
    expect(instruments.piano.drillRange).toEqual({ low: 48, high: 84 });
    expect(instruments['wind-controller'].drillRange).toEqual(instruments['alto-sax'].range);
  });
});

describe('accidentals hold to the end of the bar (common practice)', () => {
  it('prints a sign once per letter and octave, a natural where it is cancelled, and again in the next bar', () => {
    const n = notate(handDrill(['F#4', 'G4', 'F#4', 'F4', 'F#4', 'F#5', 'Bb4', 'Bb4', 'F#4', 'A4']));
    expect(show(staffEvents(n, 0))).toEqual([
      'F#4#@0/0.5',
      'G4@0.5/0.5',
      'F#4@1/0.5',
      'F4n@1.5/0.5',
      'F#4#@2/0.5',
      'F#5#@2.5/0.5',
      'Bb4b@3/0.5',
      'Bb4@3.5/0.5',
    ]);
    expect(show(staffEvents(n, 1))[0]).toBe('F#4#@0/0.5');
  });
});

describe('rests fill the bar on the beat (common practice)', () => {
  it.each([
    // five eighths end on the "and" of 3: an eighth rest to the beat, then a quarter, never a half rest from the "and"
    [5, ['r@2.5/0.5', 'r@3/1']],
    // three eighths end on the "and" of 2: an eighth rest, then a half rest on beat 3
    [3, ['r@1.5/0.5', 'r@2/2']],
    // two eighths fill beat 1: a quarter rest on 2 (a half rest starts on 1 or 3), a half on 3
    [2, ['r@1/1', 'r@2/2']],
    // one bar and a beat: the second bar rests on 2 alone, then a half on 3
    [10, ['r@1/1', 'r@2/2']],
  ] as const)('%i eighths in 4/4', (count, rests) => {
    const names = Array.from({ length: count }, () => 'C5');
    const n = notate(handDrill(names));
    const last = staffEvents(n, n.measures.length - 1);
    expect(show(last.filter((e) => e.kind === 'rest'))).toEqual(rests);
  });

  it('an empty staff of a grand staff rests for the whole bar', () => {
    const n = notate(handDrill(['C5', 'D5', 'E5', 'F5', 'G5', 'A5', 'B5', 'C6'], { instrument: 'piano' }));
    expect(show(staffEvents(n, 0, 1))).toEqual(['r@0/4']);
  });

  it('triplet gaps rest in triplet eighths inside the tuplet', () => {
    const n = notate(handDrill(['C5', 'E5', 'G5', 'C6'], { length: 1 / 3 }));
    const events = staffEvents(n, 0);
    expect(show(events)).toEqual([
      'C5@0/0.333',
      'E5@0.333/0.333',
      'G5@0.667/0.333',
      'C6@1/0.333',
      'r@1.333/0.333',
      'r@1.667/0.333',
      'r@2/2',
    ]);
    expect(new Set(events.slice(3, 6).map((e) => e.tuplet)).size).toBe(1);
    expect(events[3].tuplet).not.toBe(events[0].tuplet);
    expect(events[6].tuplet).toBeUndefined();
  });
});

describe('beams by the beat, triplets as tuplets of three', () => {
  const beamSizes = (events: NotatedEvent[]) => {
    const sizes = new Map<number, number>();
    for (const e of events) if (e.beam !== undefined) sizes.set(e.beam, (sizes.get(e.beam) ?? 0) + 1);
    return [...sizes.values()];
  };

  it.each([
    [[4, 4], 'eighth', [2, 2, 2, 2]],
    [[3, 4], 'eighth', [2, 2, 2]],
    [[6, 8], 'eighth', [3, 3]],
    [[7, 8], 'eighth', [2, 2, 3]],
    [[5, 8], 'eighth', [2, 3]],
    [[4, 4], 'sixteenth', [4, 4, 4, 4]],
    [[4, 4], 'triplet', [3, 3, 3, 3]],
    [[12, 8], 'triplet', [3, 3, 3, 3]],
  ] as const)('%j in %ss: beam groups %j in a full bar', (meter, subdivision, sizes) => {
    const pattern = { name: 'line', subdivision, source: 'scale' as const, degrees: [0, 1, 2, 3], step: 1 };
    const drill = generateDrill({
      pair: ['C', 'D'],
      pattern,
      direction: 'up',
      start: 60,
      range: { low: 60, high: 100 },
      instrument: 'flute',
      meter: [...meter],
    });
    const n = notate(drill);
    expect(beamSizes(staffEvents(n, 0))).toEqual(sizes);
    const tuplets = new Set(
      staffEvents(n, 0)
        .map((e) => e.tuplet)
        .filter((t) => t !== undefined),
    );
    // a triplet pattern in 4/4 is four tuplets; in 12/8 it is plain eighths, three to a beat
    expect(tuplets.size).toBe(subdivision === 'triplet' && meter[1] === 4 ? 4 : 0);
  });

  it('chooses one stem direction per beam group: the note farthest from the middle line decides', () => {
    // common practice: B4 is the treble's middle line; C4 E4 A5 has A5 farthest (6 steps above vs 6 below: down)
    const n = notate(handDrill(['C4', 'E4', 'G4', 'D5', 'E5', 'A5'], { length: 1 / 3 }));
    const stems = staffEvents(n, 0)
      .filter((e) => e.kind === 'note')
      .map((e) => e.stem);
    expect(stems).toEqual(['up', 'up', 'up', 'down', 'down', 'down']);
  });
});

describe('compound meters and meters a pattern cannot fill', () => {
  it('writes a triplet pattern in 6/8 as eighths, three to a dotted-quarter beat', () => {
    const drill = generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up', start: 65, meter: [6, 8] });
    expect(drill.notes.slice(0, 7).map((n) => [n.beat, n.duration, n.measure, n.beatInMeasure])).toEqual([
      [0, 0.5, 1, 1],
      [0.5, 0.5, 1, 2],
      [1, 0.5, 1, 3],
      [1.5, 0.5, 1, 4],
      [2, 0.5, 1, 5],
      [2.5, 0.5, 1, 6],
      [3, 0.5, 2, 1],
    ]);
  });

  it('counts the tempo in dotted quarters in 6/8: the MIDI file plays 80 of them a minute', () => {
    const drill = generateDrill({
      pair: ['F', 'Eb'],
      pattern: 'weave',
      direction: 'up',
      start: 65,
      meter: [6, 8],
      tempo: 80,
    });
    const played = midiToPlayed(drillToMidi(drill));
    // 80 dotted quarters a minute are 120 quarters: the second beat (three eighths in) is at 750 ms
    expect(played[3].timeMs).toBeCloseTo(750, 0);
    expect(played[6].timeMs).toBeCloseTo(1500, 0);
  });

  it.each([
    ['weave', [7, 8]],
    ['stack', [5, 8]],
    ['scale-steps-triplet', [7, 8]],
  ] as const)('refuses %s in %j, naming both', (pattern, meter) => {
    const run = () => generateDrill({ pair: ['F', 'Eb'], pattern, direction: 'up', meter: [...meter] });
    expect(run).toThrow(EngineError);
    expect(run).toThrow(new RegExp(`triplets.*${meter[0]}/${meter[1]}`));
    expect(run).toThrow(/Weave|Stack|Scale steps in triplets/);
  });

  it('refuses eighths in 7/16 (half a note left over in every bar)', () => {
    const pattern = {
      name: 'Pairs',
      subdivision: 'eighth' as const,
      source: 'scale' as const,
      degrees: [0, 1],
      step: 1,
    };
    expect(() => generateDrill({ pair: ['F', 'Eb'], pattern, direction: 'up', meter: [7, 16] })).toThrow(
      /Pairs.*7\/16/,
    );
  });
});

describe('ottava lines', () => {
  it('brings a wind controller drill over its whole range within four ledger lines', () => {
    const drill = generateDrill({
      pair: ['F', 'Eb'],
      pattern: 'weave',
      direction: 'up-down',
      instrument: 'wind-controller',
      range: { low: 36, high: 96 },
    });
    const n = notate(drill);
    const notes = n.measures.flatMap((m) => m.events.filter((e) => e.kind === 'note'));
    expect(notes.some((e) => e.ottava === 8)).toBe(true);
    expect(notes.some((e) => e.ottava === -8)).toBe(true);
    for (const e of notes) expect(ledgerLines(printedStep(e), 'treble')).toBeLessThanOrEqual(4);
  });

  it("puts the piano's top notes under a 15ma line and keeps 8va for the rest", () => {
    // common practice: B7 and C8 need eight and nine ledger lines over the treble staff, still
    // five under an 8va line, so only a two-octave line brings them within four
    const drill = generateDrill({
      pair: ['F', 'Eb'],
      pattern: 'weave',
      direction: 'up',
      instrument: 'piano',
      range: { low: 84, high: 108 },
    });
    const n = notate(drill);
    const notes = n.measures.flatMap((m) => m.events.filter((e) => e.kind === 'note'));
    expect(notes.some((e) => drill.notes[e.noteIndex!].midi >= 107)).toBe(true);
    for (const e of notes) {
      expect(ledgerLines(printedStep(e), n.staves[e.staff])).toBeLessThanOrEqual(4);
      if (drill.notes[e.noteIndex!].midi >= 107) expect(e.ottava).toBe(15);
      // a 15ma line covers only notes that one octave's shift would not serve on their own
      if (e.ottava === 15) expect(ledgerLines(stepOf(e.written!), 'treble')).toBeGreaterThan(4);
    }
    expect(notes.some((e) => e.ottava === 8)).toBe(true);
    expect(notes.every((e) => e.ottava !== -15 && e.ottava !== -8)).toBe(true);
  });

  it('keeps the smallest line: a run that tops out at A7 stays under 8va', () => {
    // A7 needs eight ledger lines over the treble staff and four under an 8va line (common practice)
    const n = notate(handDrill(['E7', 'F7', 'G7', 'A7', 'G7', 'F7', 'E7', 'D7'], { instrument: 'piano' }));
    const notes = n.measures.flatMap((m) => m.events.filter((e) => e.kind === 'note'));
    expect(notes.map((e) => e.ottava)).toEqual([8, 8, 8, 8, 8, 8, 8, 8]);
  });

  it('uses 15ma only for the note an 8va line does not serve', () => {
    // C8 needs nine ledger lines over the treble staff, five under 8va, two under 15ma (common practice)
    const n = notate(handDrill(['D7', 'F7', 'A7', 'C8', 'A7', 'F7', 'D7', 'B6'], { instrument: 'piano' }));
    const notes = n.measures.flatMap((m) => m.events.filter((e) => e.kind === 'note'));
    expect(notes.map((e) => e.ottava)).toEqual([8, 8, 8, 15, 8, 8, 8, 8]);
    for (const e of notes) expect(ledgerLines(printedStep(e), 'treble')).toBeLessThanOrEqual(4);
  });

  it('runs one 15ma line between two notes that need it rather than breaking it for 8va', () => {
    const n = notate(handDrill(['A7', 'Bb7', 'G7', 'Eb7', 'F7', 'A7', 'C8', 'A7'], { instrument: 'piano' }));
    const notes = n.measures.flatMap((m) => m.events.filter((e) => e.kind === 'note'));
    expect(notes.map((e) => e.ottava)).toEqual([8, 15, 15, 15, 15, 15, 15, 8]);
    for (const e of notes) expect(ledgerLines(printedStep(e), 'treble')).toBeLessThanOrEqual(4);
  });

  it('brings a piano drill down to A0 within four ledger lines with an 8vb line', () => {
    // A0 needs six ledger lines under the bass staff, three over an 8vb line (common practice)
    const drill = generateDrill({
      pair: ['F', 'Eb'],
      pattern: 'stack',
      direction: 'down',
      instrument: 'piano',
      range: { low: 21, high: 48 },
    });
    const n = notate(drill);
    const notes = n.measures.flatMap((m) => m.events.filter((e) => e.kind === 'note'));
    expect(notes.some((e) => drill.notes[e.noteIndex!].midi <= 23)).toBe(true);
    expect(notes.some((e) => e.ottava === -8)).toBe(true);
    expect(notes.every((e) => e.ottava !== -15)).toBe(true);
    for (const e of notes) expect(ledgerLines(printedStep(e), n.staves[e.staff])).toBeLessThanOrEqual(4);
  });

  it('marks 15mb where an 8vb line is not enough (a range far under the bass staff)', () => {
    // D0 needs eight ledger lines under the bass staff, five under an 8vb line, one under 15mb
    // (common practice)
    const n = notate(handDrill(['D1', 'A0', 'D0', 'A0', 'D1'], { instrument: 'piano' }));
    const notes = n.measures.flatMap((m) => m.events.filter((e) => e.kind === 'note'));
    expect(notes.map((e) => e.ottava)).toEqual([-8, -8, -15, -8, -8]);
    for (const e of notes) expect(ledgerLines(printedStep(e), 'bass')).toBeLessThanOrEqual(4);
  });

  it('keeps measure numbers of a slice', () => {
    const drill = generateDrill({ pair: ['F', 'B'], pattern: 'four-three', direction: 'up', start: 57 });
    expect(notate(sliceDrill(drill, 2, 3)).measures.map((m) => m.number)).toEqual([2, 3]);
  });
});

// Property: every drill, in every meter and on every instrument, notates by the rules above.
const PAIRS = allPairs();
const TRIPLET = new Set<PatternId>(['stack', 'weave', 'scale-steps-triplet']);
const specArb = fc
  .record({
    pairIndex: fc.integer({ min: 0, max: PAIRS.length - 1 }),
    pattern: fc.constantFrom<PatternId>(
      'stack',
      'weave',
      'weave-four',
      'leap-back',
      'four-three',
      'scale-steps',
      'scale-steps-triplet',
    ),
    direction: fc.constantFrom('up' as const, 'down' as const, 'up-down' as const),
    instrument: fc.constantFrom(...(Object.keys(instruments) as InstrumentId[])),
    meter: fc.constantFrom<Meter>([4, 4], [3, 4], [5, 4], [6, 8], [9, 8], [12, 8], [7, 8], [5, 8]),
    at: fc.double({ min: 0, max: 1, noNaN: true }),
    width: fc.integer({ min: 12, max: 60 }),
  })
  .filter((v) => !(TRIPLET.has(v.pattern) && v.meter[1] === 8 && v.meter[0] % 3 !== 0));

function drillOf(v: typeof specArb extends fc.Arbitrary<infer T> ? T : never): Drill | null {
  const own = instruments[v.instrument].range;
  const low = own.low + Math.floor(v.at * (own.high - own.low));
  const p = PAIRS[v.pairIndex];
  const spec: DrillSpec = {
    pair: [p.a.symbol, p.b.symbol],
    pattern: v.pattern,
    direction: v.direction,
    instrument: v.instrument,
    meter: v.meter,
    range: { low, high: Math.min(own.high, low + v.width) },
  };
  try {
    return generateDrill(spec);
  } catch (err) {
    if (err instanceof EngineError) return null;
    throw err;
  }
}

describe('notate over every preset, meter and instrument (property)', () => {
  it('fills bars, places every note once, stays within four ledger lines, beams and rests by the beat, holds accidentals', () => {
    fc.assert(
      fc.property(specArb, (v) => {
        const drill = drillOf(v);
        if (!drill) return;
        const n = notate(drill);
        const [num, den] = drill.spec.meter;
        const bar = (num * 4) / den;
        // the meter's beats in quarters (common practice: 6/8 in dotted quarters, 7/8 as 2+2+3)
        const beats =
          den === 4
            ? Array.from({ length: num }, () => 1)
            : num % 3 === 0
              ? Array.from({ length: num / 3 }, () => 1.5)
              : [...Array.from({ length: Math.floor(num / 2) - 1 }, () => 1), 1.5];
        const edges = [0];
        for (const b of beats) edges.push(edges[edges.length - 1] + b);
        const onEdge = (x: number) => edges.some((e) => Math.abs(e - x) < 1e-6);
        const beatOf = (x: number) => edges.findIndex((e, i) => x >= e - 1e-9 && x < edges[i + 1] - 1e-9);
        const seen = new Set<number>();
        expect(n.measures.map((m) => m.number)).toEqual(
          Array.from({ length: drill.measures }, (_, i) => drill.notes[0].measure + i),
        );
        for (const m of n.measures) {
          for (let s = 0; s < n.staves.length; s++) {
            const events = m.events.filter((e) => e.staff === s).sort((x, y) => x.start - y.start);
            // durations add up to the meter, one after another
            let t = 0;
            for (const e of events) {
              expect(e.start).toBeCloseTo(t, 6);
              t += e.duration;
            }
            expect(t).toBeCloseTo(bar, 6);
            const shown = new Map<number, number>();
            const beams = new Map<number, NotatedEvent[]>();
            for (const e of events) {
              if (e.kind === 'rest') {
                // a rest within one beat, or from a beat over whole beats
                const inOne = beatOf(e.start) === beatOf(e.start + e.duration - 1e-4);
                expect(inOne || (onEdge(e.start) && onEdge(e.start + e.duration))).toBe(true);
                continue;
              }
              const note = drill.notes[e.noteIndex!];
              expect(seen.has(e.noteIndex!)).toBe(false);
              seen.add(e.noteIndex!);
              expect(e.written).toBe(note.written);
              expect(m.number).toBe(note.measure);
              // no note more than four ledger lines from its staff (common practice), the piano's
              // B7 and C8 included
              expect(ledgerLines(printedStep(e), n.staves[s])).toBeLessThanOrEqual(4);
              // a reader applying the signs printed so far in the bar hears the written note
              const pos = printedStep(e);
              const alt = Note.get(e.written!).alt;
              const sign = e.accidental === '#' ? 1 : e.accidental === 'b' ? -1 : e.accidental === 'n' ? 0 : null;
              if (sign !== null) {
                expect(sign).toBe(alt);
                expect(shown.get(pos) ?? 0).not.toBe(alt);
                shown.set(pos, sign);
              } else {
                expect(shown.get(pos) ?? 0).toBe(alt);
              }
              if (e.beam !== undefined) beams.set(e.beam, [...(beams.get(e.beam) ?? []), e]);
            }
            for (const group of beams.values()) {
              expect(group.length).toBeGreaterThanOrEqual(2);
              expect(new Set(group.map((e) => beatOf(e.start))).size).toBe(1);
              expect(new Set(group.map((e) => e.stem)).size).toBe(1);
            }
            const tuplets = new Map<number, NotatedEvent[]>();
            for (const e of events)
              if (e.tuplet !== undefined) tuplets.set(e.tuplet, [...(tuplets.get(e.tuplet) ?? []), e]);
            for (const group of tuplets.values()) {
              expect(group).toHaveLength(3);
              expect(group.reduce((x, e) => x + e.duration, 0)).toBeCloseTo(1, 6);
            }
          }
        }
        expect(seen.size).toBe(drill.notes.length);
      }),
      { numRuns: 250 },
    );
  });
});
