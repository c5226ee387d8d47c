import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  allPairs,
  createLiveScorer,
  type Drill,
  type DrillNote,
  EngineError,
  generateDrill,
  type PatternId,
  type PlayedNote,
  type ScoreOptions,
  type ScoreUpdate,
  scoreTake,
  scoringWindows,
  type TakeScore,
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
const PAIRS = allPairs();

const drillArb = fc
  .record({
    pairIndex: fc.integer({ min: 0, max: PAIRS.length - 1 }),
    pattern: fc.constantFrom(...PRESETS),
    direction: fc.constantFrom<Drill['spec']['direction'][]>('up', 'down', 'up-down'),
    tempo: fc.integer({ min: 50, max: 280 }),
    low: fc.integer({ min: 40, max: 64 }),
    span: fc.integer({ min: 12, max: 30 }),
  })
  .map((v): Drill | null => {
    const p = PAIRS[v.pairIndex];
    try {
      return generateDrill({
        pair: [p.a.symbol, p.b.symbol],
        pattern: v.pattern,
        direction: v.direction,
        tempo: v.tempo,
        range: { low: v.low, high: v.low + v.span },
      });
    } catch (e) {
      if (e instanceof EngineError) return null; // no start fits this range: not a drill
      throw e;
    }
  })
  // drills of up to a few hundred notes keep the runs quick; the bench covers long takes
  .filter((d): d is Drill => d !== null && d.notes.length > 0 && d.notes.length <= 400);

const swingArb = fc.constantFrom(0.5, 0.5, 0.6, 2 / 3, 0.75);

function optionsFor(drill: Drill, mode: 'timed' | 'free', swing = 0.5): ScoreOptions {
  return { tempo: drill.spec.tempo, mode, swing };
}

function timeOf(n: DrillNote, o: ScoreOptions): number {
  const whole = Math.floor(n.beat);
  const swung = Math.abs(n.beat - whole - 0.5) < 1e-9 ? whole + (o.swing ?? 0.5) : n.beat;
  return (swung * 60000) / o.tempo;
}

function perfectTake(expected: DrillNote[], o: ScoreOptions): PlayedNote[] {
  return expected.map((n) => ({ midi: n.midi, timeMs: timeOf(n, o), velocity: 80 }));
}

/** Random drill-like lines with no generator behind them: sixteenths at fast tempi, chords, rests. */
const lineArb = fc
  .record({
    steps: fc.array(fc.constantFrom(0, 0.25, 1 / 3, 0.5, 0.5, 1, 1.5), { minLength: 1, maxLength: 40 }),
    pitches: fc.array(fc.integer({ min: 48, max: 84 }), { minLength: 40, maxLength: 40 }),
    tempo: fc.integer({ min: 40, max: 300 }),
  })
  .map(({ steps, pitches, tempo }) => {
    let beat = 0;
    const notes: DrillNote[] = steps.map((step, k) => {
      beat += k === 0 ? 0 : step;
      return {
        midi: pitches[k],
        name: '',
        written: '',
        beat,
        duration: 0.25,
        measure: Math.floor(beat / 4) + 1,
        beatInMeasure: (beat % 4) + 1,
        source: 'a',
        cell: k,
      };
    });
    return { notes, tempo };
  });

type Action = {
  kind: 'play' | 'drop' | 'wrong' | 'octave' | 'bounce' | 'extra' | 'far';
  jitter: number;
  shift: number;
};
const actionArb = fc.record({
  kind: fc.constantFrom<Action['kind'][]>(
    'play',
    'play',
    'play',
    'play',
    'drop',
    'wrong',
    'octave',
    'bounce',
    'extra',
    'far',
  ),
  jitter: fc.double({ min: -1.2, max: 1.2, noNaN: true }),
  shift: fc.integer({ min: -13, max: 13 }),
});

/** A messy take: notes off the beat by up to 1.2 match windows, wrong, left out, bounced, stray. */
function messyTake(expected: DrillNote[], o: ScoreOptions, actions: Action[]): PlayedNote[] {
  const { matchWindowMs } = o.mode === 'timed' ? scoringWindows(expected, o) : { matchWindowMs: 100 };
  const out: PlayedNote[] = [];
  expected.forEach((n, k) => {
    const a = actions[k % actions.length];
    const t = timeOf(n, o) + a.jitter * matchWindowMs;
    if (a.kind === 'drop') return;
    const midi = a.kind === 'wrong' ? n.midi + (a.shift || 1) : a.kind === 'octave' ? n.midi + 12 : n.midi;
    out.push({ midi, timeMs: a.kind === 'far' ? t + 3 * matchWindowMs : t });
    if (a.kind === 'bounce') out.push({ midi, timeMs: t + Math.abs(a.jitter) * 30 });
    if (a.kind === 'extra') out.push({ midi: n.midi + a.shift, timeMs: t + a.jitter * 200 });
  });
  return out;
}

/**
 * Plays a take into the live scorer in time order, ticking at random moments between notes,
 * and checks each settled result against the batch score as it arrives.
 */
function liveAgrees(expected: DrillNote[], played: PlayedNote[], o: ScoreOptions, tickSeeds: number[]): void {
  const free = o.mode === 'free';
  const order = played.map((_, k) => k);
  if (!free) order.sort((x, y) => played[x].timeMs - played[y].timeMs || x - y);
  const inOrder = order.map((k) => played[k]);
  // the batch scorer over the notes as pushed, so indices line up
  const batch: TakeScore = scoreTake(expected, inOrder, o);
  const live = createLiveScorer(expected, o);
  const settled = new Set<number>();
  const check = (ups: ScoreUpdate[]) => {
    for (const u of ups) {
      if (!u.settled) continue;
      expect(settled.has(u.index), `index ${u.index} settled twice`).toBe(false);
      settled.add(u.index);
      expect(u.result).toEqual(batch.results[u.index]);
    }
  };
  let clock = Number.NEGATIVE_INFINITY;
  inOrder.forEach((note, k) => {
    const seed = tickSeeds[k % tickSeeds.length];
    if (!free && seed > 0.3 && Number.isFinite(clock)) {
      check(live.tick(Math.min(note.timeMs, clock + (note.timeMs - clock) * seed)));
      check(live.tick(note.timeMs));
    }
    check(live.push(note));
    clock = note.timeMs;
  });
  if (!free) check(live.tick(1e12));
  expect(live.finish()).toEqual(batch);
  if (!free) expect(settled.size).toBe(expected.length);
}

describe('scoring properties (fast-check)', () => {
  it('a perfect take of any generated drill scores 1.0, timed (any swing) and free', () => {
    fc.assert(
      fc.property(drillArb, swingArb, fc.boolean(), (drill, swing, free) => {
        const o = optionsFor(drill, free ? 'free' : 'timed', swing);
        const score = scoreTake(drill.notes, perfectTake(drill.notes, o), o);
        expect(score.accuracy).toBe(1);
        expect(score.extras).toEqual([]);
        expect(score.results.every((r, k) => r.verdict === 'hit' && r.playedIndex === k)).toBe(true);
      }),
      { numRuns: 80 },
    );
  });

  it('removing k notes from a perfect take gives exactly k misses and no other mistake', () => {
    fc.assert(
      fc.property(drillArb, fc.array(fc.nat(), { maxLength: 12 }), fc.boolean(), (drill, picks, free) => {
        const o = optionsFor(drill, free ? 'free' : 'timed');
        const removed = new Set(picks.map((p) => p % drill.notes.length));
        const played = perfectTake(drill.notes, o).filter((_, k) => !removed.has(k));
        const score = scoreTake(drill.notes, played, o);
        const missed = score.results.filter((r) => r.verdict === 'missed').length;
        expect(missed).toBe(removed.size);
        expect(score.results.filter((r) => r.verdict === 'hit').length).toBe(drill.notes.length - removed.size);
        expect(score.extras).toEqual([]);
      }),
      { numRuns: 80 },
    );
  });

  it("the live scorer's settled results equal the batch scorer's on messy takes of generated drills", () => {
    fc.assert(
      fc.property(
        drillArb,
        swingArb,
        fc.constantFrom<'timed' | 'free'>('timed', 'timed', 'free'),
        fc.boolean(),
        fc.array(actionArb, { minLength: 1, maxLength: 30 }),
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 10 }),
        (drill, swing, mode, octaveTolerant, actions, ticks) => {
          const o: ScoreOptions = { ...optionsFor(drill, mode, swing), octaveTolerant };
          liveAgrees(drill.notes, messyTake(drill.notes, o, actions), o, ticks);
        },
      ),
      { numRuns: Number(process.env.SCORING_RUNS ?? 120) }, // SCORING_RUNS=2000 for a longer hunt
    );
  });

  it('... and on messy takes of random lines with overlapping windows, chords and rests', () => {
    fc.assert(
      fc.property(
        lineArb,
        swingArb,
        fc.constantFrom<'timed' | 'free'>('timed', 'timed', 'free'),
        fc.array(actionArb, { minLength: 1, maxLength: 30 }),
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 10 }),
        (line, swing, mode, actions, ticks) => {
          const o: ScoreOptions = { tempo: line.tempo, mode, swing };
          liveAgrees(line.notes, messyTake(line.notes, o, actions), o, ticks);
        },
      ),
      { numRuns: Number(process.env.SCORING_RUNS ?? 300) },
    );
  });

  it('free mode settles a clean run no more than the band behind the last note', () => {
    const notes: DrillNote[] = Array.from({ length: 300 }, (_, k) => ({
      midi: 60 + (k % 12),
      name: '',
      written: '',
      beat: k / 2,
      duration: 0.5,
      measure: Math.floor(k / 8) + 1,
      beatInMeasure: ((k / 2) % 4) + 1,
      source: 'scale',
      cell: k,
    }));
    const live = createLiveScorer(notes, { tempo: 100, mode: 'free' });
    let settled = 0;
    notes.forEach((n, k) => {
      settled += live.push({ midi: n.midi, timeMs: k }).filter((u) => u.settled).length;
      expect(k + 1 - settled).toBeLessThanOrEqual(65);
    });
  });
});
