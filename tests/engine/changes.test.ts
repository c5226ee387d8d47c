import fc from 'fast-check';
import { parseMidi } from 'midi-file';
import { Chord, Note } from 'tonal';
import { describe, expect, it } from 'vitest';
import {
  type ChordChange,
  type Direction,
  type Drill,
  type DrillSpec,
  EngineError,
  type InstrumentId,
  type PatternId,
  drillToMidi,
  generateDrill,
  inAllKeys,
  instruments,
  pairsForChord,
  parseTriad,
  presets,
} from '../../shared/engine';

const PRESETS = Object.keys(presets) as PatternId[];
const DIRECTIONS: Direction[] = ['up', 'down', 'up-down'];
const INSTRUMENTS = Object.keys(instruments) as InstrumentId[];

// common practice: the usual teaching progressions
const II_V_I: ChordChange[] = [
  { chord: 'Dm7', beats: 4 },
  { chord: 'G7', beats: 4 },
  { chord: 'Cmaj7', beats: 8 },
];
const BLUES: ChordChange[] = ['F7', 'Bb7', 'F7', 'F7', 'Bb7', 'Bb7', 'F7', 'D7', 'Gm7', 'C7', 'F7', 'C7'].map(
  (chord) => ({ chord, beats: 4 }),
);

const chromaCache = new Map<string, Set<number>>();
/** Pitch classes (0-11) of a pair, read with tonal, independently of the engine's ladders. */
function chromasOf(pair: [string, string]): Set<number> {
  const key = pair.join('/');
  let out = chromaCache.get(key);
  if (!out) {
    out = new Set<number>();
    for (const symbol of pair) for (const pc of parseTriad(symbol).pitchClasses) out.add(Note.chroma(pc) as number);
    chromaCache.set(key, out);
  }
  return out;
}

const fitCache = new Map<string, string[][]>();
/** The chord's first three fits, as the fit finder ranks them. */
function firstThree(chord: string): string[][] {
  let fits = fitCache.get(chord);
  if (!fits) {
    fits = pairsForChord(chord)
      .slice(0, 3)
      .map((f) => [f.pair.a.symbol, f.pair.b.symbol]);
    fitCache.set(chord, fits);
  }
  return fits;
}

const NOTES_PER_QUARTER: Record<string, number> = { eighth: 2, triplet: 3, sixteenth: 4 };

function perQuarter(pattern: PatternId): number {
  return NOTES_PER_QUARTER[presets[pattern].subdivision];
}

/** Checks every promise of a progression drill that does not depend on the fit ranking. */
function checkDrill(d: Drill, spec: DrillSpec): void {
  const changes = spec.changes ?? [];
  const choruses = spec.choruses ?? 1;
  const total = changes.reduce((s, c) => s + c.beats, 0) * choruses;
  const per = perQuarter(spec.pattern as PatternId);
  const played = d.changes ?? [];
  // one entry per chord per chorus, back to back from beat 0
  expect(played).toHaveLength(changes.length * choruses);
  let at = 0;
  played.forEach((c, i) => {
    expect(c.chord).toBe(changes[i % changes.length].chord);
    expect(c.beats).toBe(changes[i % changes.length].beats);
    expect(c.startBeat).toBeCloseTo(at, 9);
    at += c.beats;
  });
  // it lasts exactly the progression's beats x choruses: a note on every subdivision
  expect(d.notes).toHaveLength(Math.round(total * per));
  const last = d.notes[d.notes.length - 1];
  expect(last.beat + last.duration).toBeCloseTo(total, 9);
  const [num, den] = d.spec.meter;
  expect(d.measures).toBe(Math.ceil(total / ((num * 4) / den) - 1e-9));
  const { low, high } = d.spec.range;
  d.notes.forEach((n, i) => {
    expect(n.beat).toBeCloseTo(i / per, 9);
    expect(n.midi).toBeGreaterThanOrEqual(low);
    expect(n.midi).toBeLessThanOrEqual(high);
    // every note lies in its own chord's pair, and inside that chord's time
    const c = played[n.chordIndex as number];
    expect(c, `note ${i} has a chord`).toBeDefined();
    expect(chromasOf(c.pair).has(n.midi % 12), `note ${i} (${n.name}) in ${c.pair.join('/')}`).toBe(true);
    expect(n.beat).toBeGreaterThanOrEqual(c.startBeat - 1e-9);
    expect(n.beat).toBeLessThan(c.startBeat + c.beats - 1e-9);
    // the spelled name sounds the note it names (tonal)
    expect(Note.midi(n.name)).toBe(n.midi);
  });
  // a cell never spans a chord change
  for (let i = 1; i < d.notes.length; i++) {
    if (d.notes[i].chordIndex !== d.notes[i - 1].chordIndex) expect(d.notes[i].cell).toBe(d.notes[i - 1].cell + 1);
  }
  // pinned pairs are kept, every other pair is among its chord's first three fits
  played.forEach((c, i) => {
    const pinned = changes[i % changes.length].pair;
    if (pinned) expect(c.pair).toEqual(pinned);
    else expect(firstThree(c.chord)).toContainEqual(c.pair);
  });
}

describe('drills over changes', () => {
  it('ii-V-I in C: the drill lasts 16 beats, each chord has its pair, the first chord its first fit', () => {
    const spec: DrillSpec = { pattern: 'weave', direction: 'up', changes: II_V_I };
    const d = generateDrill(spec);
    checkDrill(d, spec);
    expect(d.changes?.map((c) => c.startBeat)).toEqual([0, 4, 8]);
    expect(d.changes?.[0].pair).toEqual(firstThree('Dm7')[0]);
    expect(d.spec.pair).toEqual(d.changes?.[0].pair);
    expect(d.notes).toHaveLength(48); // 16 beats of triplet eighths
    expect(d.measures).toBe(4);
    expect(d.notes.every((n) => n.chordIndex === (n.beat < 4 ? 0 : n.beat < 8 ? 1 : 2))).toBe(true);
  });

  it('an unpinned chord takes, among its first three fits, the one with a tone nearest the last note (ties to the better fit)', () => {
    for (const pattern of PRESETS) {
      const spec: DrillSpec = { pattern, direction: 'up', changes: BLUES, choruses: 2 };
      const d = generateDrill(spec);
      const played = d.changes ?? [];
      for (let i = 1; i < played.length; i++) {
        const lastNote = d.notes.filter((n) => n.chordIndex === i - 1).pop();
        if (!lastNote) continue;
        const dist = (pair: string[]) => {
          const pcs = chromasOf(pair as [string, string]);
          let best = 12;
          for (const c of pcs) {
            const x = (((c - lastNote.midi) % 12) + 12) % 12;
            best = Math.min(best, x, 12 - x);
          }
          return best;
        };
        const fits = firstThree(played[i].chord);
        const want = fits.reduce((best, p) => (dist(p) < dist(best) ? p : best), fits[0]);
        expect(played[i].pair, `${pattern}, chord ${i} (${played[i].chord})`).toEqual(want);
      }
    }
  });

  it('every preset, direction and instrument: notes in their chord pair, exact length, chosen pairs fit (property)', () => {
    const chords = ['Dm7', 'G7', 'Cmaj7', 'F7', 'Bb7', 'Am7', 'D7', 'Cm7', 'F#m7b5', 'B7', 'Ebmaj7', 'G7alt', 'Fm7'];
    const change = fc.record({
      chord: fc.constantFrom(...chords),
      beats: fc.constantFrom(1, 2, 3, 4, 8),
    });
    fc.assert(
      fc.property(
        fc.array(change, { minLength: 1, maxLength: 8 }),
        fc.constantFrom(...PRESETS),
        fc.constantFrom(...DIRECTIONS),
        fc.constantFrom(...INSTRUMENTS),
        fc.integer({ min: 1, max: 3 }),
        (changes, pattern, direction, instrument, choruses) => {
          const spec: DrillSpec = { pattern, direction, instrument, changes, choruses };
          checkDrill(generateDrill(spec), spec);
        },
      ),
      { numRuns: 150 },
    );
  });

  it('pinned pairs are kept in every chorus, and the others still chosen', () => {
    const changes: ChordChange[] = [
      { chord: 'Dm7', beats: 4, pair: ['F', 'G'] },
      { chord: 'G7', beats: 4, pair: ['Db', 'Eb'] },
      { chord: 'Cmaj7', beats: 8 },
    ];
    const spec: DrillSpec = { pattern: 'four-three', direction: 'up', changes, choruses: 3 };
    const d = generateDrill(spec);
    checkDrill(d, spec);
    expect(d.changes?.filter((c) => c.chord === 'G7').map((c) => c.pair)).toEqual([
      ['Db', 'Eb'],
      ['Db', 'Eb'],
      ['Db', 'Eb'],
    ]);
  });

  it('turns around at the range edges instead of stopping: a long blues in a narrow range goes up and down', () => {
    for (const pattern of PRESETS) {
      const spec: DrillSpec = {
        pattern,
        direction: 'up',
        changes: BLUES,
        choruses: 3,
        range: { low: 55, high: 79 },
      };
      const d = generateDrill(spec);
      checkDrill(d, spec);
      const midis = d.notes.map((n) => n.midi);
      // it reaches both edges' neighbourhoods more than once
      expect(Math.max(...midis)).toBeGreaterThan(72);
      expect(Math.min(...midis)).toBeLessThan(62);
    }
  });

  it('each chord starts a new cell entering on its own triad, next to the last note', () => {
    const changes: ChordChange[] = [
      { chord: 'Dm7', beats: 2 },
      { chord: 'G7', beats: 2 },
      { chord: 'Cmaj7', beats: 4 },
    ];
    const spec: DrillSpec = { pattern: 'stack', direction: 'up', changes, range: { low: 36, high: 108 } };
    const d = generateDrill(spec);
    for (let i = 1; i < d.notes.length; i++) {
      const n = d.notes[i];
      const prev = d.notes[i - 1];
      if (n.chordIndex === prev.chordIndex) continue;
      const pair = (d.changes ?? [])[n.chordIndex as number].pair;
      const triad = parseTriad(n.source === 'a' ? pair[0] : pair[1]);
      const tones = new Set(triad.pitchClasses.map((pc) => Note.chroma(pc)));
      // 'above': the closest tone of this triad above the last note (the line is rising here)
      let want = prev.midi + 1;
      while (!tones.has(want % 12)) want++;
      expect(n.midi).toBe(want);
    }
  });

  it('a cell cut by a chord change ends there; the cells alternate a, b through the progression', () => {
    // weave-four cells last two beats; one-beat chords cut every cell in half
    const changes: ChordChange[] = ['Dm7', 'G7', 'Em7', 'A7'].map((chord) => ({ chord, beats: 1 }));
    const spec: DrillSpec = { pattern: 'weave-four', direction: 'up', changes, choruses: 2 };
    const d = generateDrill(spec);
    checkDrill(d, spec);
    expect(d.notes.map((n) => n.cell)).toEqual([0, 0, 1, 1, 2, 2, 3, 3, 4, 4, 5, 5, 6, 6, 7, 7]);
    expect(d.notes.map((n) => n.source).join('')).toBe('aabbaabbaabbaabb');
  });

  it('a drill in 3/4 and a chord of three beats keeps its measures', () => {
    const changes: ChordChange[] = [
      { chord: 'Cmaj7', beats: 3 },
      { chord: 'A7', beats: 3 },
    ];
    const spec: DrillSpec = { pattern: 'scale-steps', direction: 'down', changes, meter: [3, 4], choruses: 2 };
    const d = generateDrill(spec);
    checkDrill(d, spec);
    expect(d.measures).toBe(4);
    expect(d.notes.filter((n) => n.beatInMeasure === 1).map((n) => n.measure)).toEqual([1, 2, 3, 4]);
  });

  it('in 6/8 a triplet pattern runs in plain eighths, three to the dotted-quarter beat', () => {
    // common practice: compound meters write triplet figures as eighths
    const changes: ChordChange[] = [
      { chord: 'Cmaj7', beats: 3 },
      { chord: 'A7', beats: 3 },
    ];
    const d = generateDrill({ pattern: 'weave', direction: 'up', changes, meter: [6, 8], choruses: 2 });
    expect(d.notes).toHaveLength(24);
    expect(d.notes.every((n) => n.duration === 0.5)).toBe(true);
    expect(d.measures).toBe(4);
    expect(d.changes?.map((c) => c.startBeat)).toEqual([0, 3, 6, 9]);
    expect(d.notes.filter((n) => n.chordIndex === 1).map((n) => n.beat)).toEqual([3, 3.5, 4, 4.5, 5, 5.5]);
    expect(() => generateDrill({ pattern: 'weave', direction: 'up', changes, meter: [7, 8] })).toThrow(/7\/8/);
  });

  it('says what is wrong with a bad progression', () => {
    const bad =
      (changes: unknown, extra: Partial<DrillSpec> = {}) =>
      () =>
        generateDrill({ pattern: 'weave', direction: 'up', changes: changes as ChordChange[], ...extra });
    expect(bad([])).toThrow(EngineError);
    expect(
      bad([
        { chord: 'Dm7', beats: 4 },
        { chord: 'Qx9', beats: 4 },
      ]),
    ).toThrow(/Qx9/);
    expect(bad([{ chord: 'Dm7', beats: 0 }])).toThrow(/beats/);
    // triplet eighths cannot fill half a beat exactly
    expect(bad([{ chord: 'Dm7', beats: 1.5 }])).toThrow(/1\.5 beats/);
    expect(bad([{ chord: 'Dm7', beats: 4, pair: ['C', 'Am'] }])).toThrow(/share a note/);
    expect(bad(II_V_I, { choruses: 0 })).toThrow(/choruses/);
    expect(() => generateDrill({ pattern: 'weave', direction: 'up' } as DrillSpec)).toThrow(EngineError);
  });
});

describe('the key cycle of a progression', () => {
  it('moves every chord and every pinned pair with the key, in each order', () => {
    const changes: ChordChange[] = [
      { chord: 'Dm7', beats: 4 },
      { chord: 'G7', beats: 4, pair: ['Db', 'Eb'] },
      { chord: 'Cmaj7', beats: 8 },
    ];
    const spec: DrillSpec = { pattern: 'weave', direction: 'up', changes, instrument: 'alto-sax' };
    const steps = { chromatic: 1, fourths: 5, fifths: 7 } as const;
    for (const order of ['chromatic', 'fourths', 'fifths'] as const) {
      const cycle = inAllKeys(spec, order);
      expect(cycle).toHaveLength(12);
      const firstRoots = new Set<number>();
      cycle.forEach((d, k) => {
        const shift = (k * steps[order]) % 12;
        const moved = d.spec.changes ?? [];
        moved.forEach((c, i) => {
          const [tonic, type] = Chord.tokenize(c.chord);
          const [tonic0, type0] = Chord.tokenize(changes[i].chord);
          // tonal: the root moved by the key's interval, the chord's type kept
          expect(((Note.chroma(tonic) as number) - (Note.chroma(tonic0) as number) + 12) % 12).toBe(shift);
          expect(type).toBe(type0);
          expect(c.beats).toBe(changes[i].beats);
        });
        const pinned = moved[1].pair as [string, string];
        // Db (chroma 1) moved by the key's interval
        expect(((Note.chroma(parseTriad(pinned[0]).root) as number) - 1 + 12) % 12).toBe(shift);
        expect(parseTriad(pinned[1]).quality).toBe('major');
        // the played progression follows the moved spec, the pinned pair kept
        expect(d.changes?.[1].pair).toEqual(pinned);
        checkDrill(d, { ...spec, changes: moved });
        firstRoots.add(Note.chroma(Chord.tokenize(moved[0].chord)[0]) as number);
      });
      expect(firstRoots.size).toBe(12);
    }
  });

  it('a 12-bar blues in all 12 keys with every preset builds', () => {
    for (const pattern of PRESETS) {
      const cycle = inAllKeys({ pattern, direction: 'up', changes: BLUES }, 'fourths');
      expect(cycle.map((d) => d.spec.changes?.[0].chord)).toEqual([
        'F7',
        'Bb7',
        'Eb7',
        'Ab7',
        'Db7',
        'F#7',
        'B7',
        'E7',
        'A7',
        'D7',
        'G7',
        'C7',
      ]);
      for (const d of cycle) checkDrill(d, { pattern, direction: 'up', changes: d.spec.changes });
    }
  });
});

describe('MIDI of a progression drill', () => {
  it('carries a marker per chord at its start, read back by an independent parser (midi-file)', () => {
    const d = generateDrill({ pattern: 'weave', direction: 'up', changes: II_V_I, choruses: 2, tempo: 90 });
    const midi = parseMidi(drillToMidi(d));
    const ppq = midi.header.ticksPerBeat as number;
    const markers: { text: string; tick: number }[] = [];
    for (const track of midi.tracks) {
      let tick = 0;
      for (const e of track) {
        tick += e.deltaTime;
        // Standard MIDI Files 1.0: meta event FF 06 is a marker
        if (e.type === 'marker') markers.push({ text: e.text, tick });
      }
    }
    expect(markers).toEqual((d.changes ?? []).map((c) => ({ text: c.chord, tick: Math.round(c.startBeat * ppq) })));
    expect(markers.map((m) => m.text)).toEqual(['Dm7', 'G7', 'Cmaj7', 'Dm7', 'G7', 'Cmaj7']);
    expect(markers.map((m) => m.tick / ppq)).toEqual([0, 4, 8, 16, 20, 24]);
  });

  it('a drill without changes has no markers', () => {
    const d = generateDrill({ pair: ['D', 'C'], pattern: 'weave', direction: 'up' });
    const midi = parseMidi(drillToMidi(d));
    expect(midi.tracks.flat().some((e) => e.type === 'marker')).toBe(false);
  });
});
