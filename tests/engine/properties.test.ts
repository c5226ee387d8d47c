import fc from 'fast-check';
import { Note } from 'tonal';
import { describe, expect, it } from 'vitest';
import {
  type Direction,
  type Drill,
  type DrillSpec,
  EngineError,
  type InstrumentId,
  type PatternId,
  allPairs,
  drillToMidi,
  generateDrill,
  inAllKeys,
  instruments,
  midiToPlayed,
  parseTriad,
  quarterTempo,
} from '../../shared/engine';

const PRESETS: PatternId[] = [
  'stack',
  'weave',
  'weave-four',
  'leap-back',
  'four-three',
  'scale-steps',
  'scale-steps-triplet',
];
const DIRECTIONS: Direction[] = ['up', 'down', 'up-down'];
const INSTRUMENTS = Object.keys(instruments) as InstrumentId[];
const CELL_NOTES: Record<PatternId, number> = {
  stack: 3,
  weave: 3,
  'weave-four': 4,
  'leap-back': 4,
  'four-three': 0, // 4 + 3: checked per triad below
  'scale-steps': 8,
  'scale-steps-triplet': 6,
};
const PAIRS = allPairs();

const TRIPLET_PRESETS = new Set<PatternId>(['stack', 'weave', 'scale-steps-triplet']);

// Triplets cannot fill 7/8 or 5/8 (generateDrill refuses them, tested in notation.test.ts), so
// those meters are drawn only with patterns in eighths.
const specArb = fc
  .record({
    pairIndex: fc.integer({ min: 0, max: PAIRS.length - 1 }),
    swap: fc.boolean(),
    pattern: fc.constantFrom(...PRESETS),
    direction: fc.constantFrom(...DIRECTIONS),
    instrument: fc.constantFrom(...INSTRUMENTS),
    meter: fc.constantFrom<[number, number]>([4, 4], [3, 4], [5, 4], [6, 8], [7, 8], [5, 8], [9, 8], [12, 8]),
  })
  .filter((v) => !(TRIPLET_PRESETS.has(v.pattern) && v.meter[1] === 8 && v.meter[0] % 3 !== 0));

type SpecValues = typeof specArb extends fc.Arbitrary<infer T> ? T : never;

function specOf(v: SpecValues): DrillSpec {
  const p = PAIRS[v.pairIndex];
  const pair: [string, string] = v.swap ? [p.b.symbol, p.a.symbol] : [p.a.symbol, p.b.symbol];
  return { pair, pattern: v.pattern, direction: v.direction, instrument: v.instrument, meter: v.meter };
}

/**
 * Every property the contract promises of one drill, as a list of broken promises (plain checks:
 * an expect per note would make the runs slow).
 */
function problemsOf(d: Drill): string[] {
  const { range, instrument, pattern, meter } = d.spec;
  const a = parseTriad(d.spec.pair[0]);
  const b = parseTriad(d.spec.pair[1]);
  const transposition = instruments[instrument].transposition;
  const measureLen = (meter[0] * 4) / meter[1];
  const cellSizes = new Map<number, number>();
  const bad: string[] = [];
  const near = (x: number, y: number) => Math.abs(x - y) < 1e-9;
  d.notes.forEach((n, i) => {
    if (n.midi < range.low || n.midi > range.high) bad.push(`${i}: ${n.midi} outside the range`);
    const pc = Note.pitchClass(n.name);
    const triad = n.source === 'b' ? b : n.source === 'a' ? a : a.pitchClasses.includes(pc) ? a : b;
    // spelling follows the triad the note belongs to (tonal as reference library)
    if (!triad.pitchClasses.includes(pc)) bad.push(`${i}: ${n.name} not in ${triad.symbol}`);
    // MIDI 1.0 numbering: the spelled name sounds the note's number (C4 = 60)
    if (Note.midi(n.name) !== n.midi) bad.push(`${i}: ${n.name} is not MIDI ${n.midi}`);
    if (Note.midi(n.written) !== n.midi - transposition) bad.push(`${i}: written ${n.written} for ${n.midi}`);
    // time: one subdivision after another, placed in its measure
    if (i > 0 && !near(n.beat, d.notes[i - 1].beat + d.notes[i - 1].duration)) bad.push(`${i}: beat ${n.beat}`);
    if (!near((n.measure - 1) * measureLen + ((n.beatInMeasure - 1) * 4) / meter[1], n.beat)) {
      bad.push(`${i}: measure ${n.measure} beat ${n.beatInMeasure} is not ${n.beat}`);
    }
    cellSizes.set(n.cell, (cellSizes.get(n.cell) ?? 0) + 1);
  });
  const id = pattern as PatternId;
  const full = [...cellSizes.entries()].filter(([cell, size]) => {
    if (id !== 'four-three') return size === CELL_NOTES[id];
    const first = d.notes.find((n) => n.cell === cell)!;
    return size === (first.source === 'a' ? 4 : 3);
  });
  if (full.length < 2) bad.push(`only ${full.length} full cells`);
  const end = d.notes[d.notes.length - 1];
  if (d.measures !== Math.ceil((end.beat + end.duration) / measureLen - 1e-9)) bad.push(`measures ${d.measures}`);
  return bad;
}

function checkDrill(d: Drill): void {
  expect(problemsOf(d)).toEqual([]);
}

describe('every preset, key, direction and instrument', () => {
  it('stays in the range and the pair, spells names to their numbers, plays two full cells', () => {
    fc.assert(
      fc.property(specArb, (v) => {
        checkDrill(generateDrill(specOf(v)));
      }),
      { numRuns: 400 },
    );
  });

  it('keeps those promises in any range wide enough, and refuses narrower ones with EngineError', () => {
    fc.assert(
      fc.property(
        specArb,
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.integer({ min: 0, max: 40 }),
        (v, at, width) => {
          // a range inside the instrument's own, so written pitches stay MIDI numbers
          const own = instruments[v.instrument].range;
          const low = own.low + Math.floor(at * (own.high - own.low));
          const spec = { ...specOf(v), range: { low, high: Math.min(own.high, low + width) } };
          let drill: Drill;
          try {
            drill = generateDrill(spec);
          } catch (err) {
            expect(err).toBeInstanceOf(EngineError);
            return;
          }
          checkDrill(drill);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('the 12 drills of a key cycle are transpositions of one another wherever the range allows', () => {
    fc.assert(
      fc.property(specArb, fc.constantFrom('chromatic', 'fourths', 'fifths' as const), (v, order) => {
        const spec = specOf(v);
        const start = generateDrill(spec).spec.start;
        const drills = inAllKeys({ ...spec, start }, order);
        expect(drills).toHaveLength(12);
        const upLength = (d: Drill) =>
          d.spec.direction === 'up-down' ? generateDrill({ ...d.spec, direction: 'up' }).notes.length : d.notes.length;
        const first = drills[0];
        const roots = new Set<number>();
        for (const d of drills) {
          checkDrill(d);
          const root = Note.chroma(parseTriad(d.spec.pair[0]).root) ?? -1;
          roots.add(root);
          // Where the range does not allow the moved start in any octave, the drill starts on
          // another tone of the triad (the default start): not a transposition, by design.
          const firstRoot = Note.chroma(parseTriad(first.spec.pair[0]).root) ?? -1;
          if ((((d.spec.start - first.spec.start - (root - firstRoot)) % 12) + 12) % 12 !== 0) continue;
          const shift = d.notes[0].midi - first.notes[0].midi;
          const n = Math.min(upLength(first), upLength(d));
          const off: number[] = [];
          for (let i = 0; i < n; i++) {
            const x = d.notes[i];
            const y = first.notes[i];
            if (x.midi - y.midi !== shift || x.source !== y.source || x.cell !== y.cell) off.push(i);
          }
          expect(off).toEqual([]);
        }
        expect(roots.size).toBe(12);
      }),
      { numRuns: 80 },
    );
  });

  it('holds over the whole grid: 7 presets x 12 keys x 3 directions x 11 instruments', () => {
    const roots = ['C', 'Db', 'D', 'Eb', 'E', 'F', 'F#', 'G', 'Ab', 'A', 'Bb', 'B'];
    const problems: string[] = [];
    for (const pattern of PRESETS) {
      for (const direction of DIRECTIONS) {
        for (const instrument of INSTRUMENTS) {
          roots.forEach((root, k) => {
            // a minor triad over the major triad a whole step below, moved to each key
            const pair: [string, string] = [`${root}m`, roots[(k + 10) % 12]];
            const d = generateDrill({ pair, pattern, direction, instrument });
            for (const p of problemsOf(d))
              problems.push(`${pair.join('/')} ${pattern} ${direction} ${instrument}: ${p}`);
          });
        }
      }
    }
    expect(problems.slice(0, 10)).toEqual([]);
  });

  it('every drill reads back from its own MIDI file', () => {
    fc.assert(
      fc.property(specArb, fc.integer({ min: 40, max: 240 }), (v, tempo) => {
        const drill = generateDrill({ ...specOf(v), tempo });
        const played = midiToPlayed(drillToMidi(drill));
        expect(played.map((p) => p.midi)).toEqual(drill.notes.map((n) => n.midi));
        // the tempo counts dotted quarters in 6/8, 9/8 and 12/8
        const msPerBeat = 60_000 / quarterTempo(tempo, drill.spec.meter);
        played.forEach((p, i) => {
          // Standard MIDI Files 1.0: tempo is whole microseconds per quarter, ticks are whole numbers
          expect(Math.abs(p.timeMs - drill.notes[i].beat * msPerBeat)).toBeLessThan(2);
        });
      }),
      { numRuns: 60 },
    );
  });
});

describe('midiToPlayed on damaged files', () => {
  it('returns notes or throws EngineError, never anything else', () => {
    const good = drillToMidi(generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up', start: 65 }));
    fc.assert(
      fc.property(
        fc.array(fc.record({ at: fc.nat(), byte: fc.integer({ min: 0, max: 255 }) }), { maxLength: 12 }),
        fc.nat(),
        (edits, cut) => {
          const bytes = good.slice(0, 14 + (cut % (good.length - 13)));
          for (const e of edits) bytes[e.at % bytes.length] = e.byte;
          try {
            const notes = midiToPlayed(bytes);
            expect(notes.length).toBeGreaterThan(0);
          } catch (err) {
            expect(err).toBeInstanceOf(EngineError);
          }
        },
      ),
      { numRuns: 500 },
    );
  });
});
