import { describe, expect, it } from 'vitest';
import {
  createLiveScorer,
  type DrillNote,
  type NoteResult,
  type PlayedNote,
  type ScoreOptions,
  type ScoreUpdate,
  scoreTake,
  scoringWindows,
  type TakeScore,
} from '../../shared/engine';

/** A scorer case: expected notes, played notes, options, and the TakeScore worked out by hand. */
interface ScoringFixture {
  name: string;
  description: string;
  expected: DrillNote[];
  played: PlayedNote[];
  options: ScoreOptions;
  score: TakeScore;
}

const files = import.meta.glob<ScoringFixture>('../../fixtures/scoring/*.json', { eager: true, import: 'default' });
const fixtures = Object.values(files).sort((x, y) => x.name.localeCompare(y.name));

function expectNumber(actual: number | null, wanted: number | null, what: string) {
  if (wanted === null) expect(actual, what).toBeNull();
  else expect(actual, what).toBeCloseTo(wanted, 9);
}

function expectResult(actual: NoteResult | undefined, wanted: NoteResult, what: string) {
  expect(actual?.verdict, what).toBe(wanted.verdict);
  expect(actual?.playedIndex, what).toBe(wanted.playedIndex);
  expectNumber(actual?.offsetMs ?? null, wanted.offsetMs, what);
}

function expectScore(actual: TakeScore, wanted: TakeScore) {
  expect(actual.results).toHaveLength(wanted.results.length);
  wanted.results.forEach((r, k) => {
    expectResult(actual.results[k], r, `result ${k}`);
  });
  expect(actual.extras).toEqual(wanted.extras);
  expect(actual.accuracy).toBeCloseTo(wanted.accuracy, 12);
  expectNumber(actual.meanOffsetMs, wanted.meanOffsetMs, 'meanOffsetMs');
  expectNumber(actual.spreadMs, wanted.spreadMs, 'spreadMs');
}

/** Plays a fixture into the live scorer the way the practice page would: in time order, ticking between notes. */
function playLive(f: ScoringFixture) {
  const free = f.options.mode === 'free';
  const order = f.played.map((_, k) => k);
  if (!free) order.sort((x, y) => f.played[x].timeMs - f.played[y].timeMs || x - y);
  const live = createLiveScorer(f.expected, f.options);
  const asPassed = (u: ScoreUpdate): ScoreUpdate => ({
    ...u,
    result: { ...u.result, playedIndex: u.result.playedIndex === null ? null : order[u.result.playedIndex] },
  });
  const updates: ScoreUpdate[] = [];
  const onPush: ScoreUpdate[][] = [];
  let clock = Math.min(0, ...f.played.map((p) => p.timeMs)) - 200;
  for (const k of order) {
    const note = f.played[k];
    if (!free) {
      for (let t = clock + 16; t < note.timeMs; t += 16) updates.push(...live.tick(t).map(asPassed));
      clock = note.timeMs;
    }
    const got = live.push(note).map(asPassed);
    onPush.push(got);
    updates.push(...got);
  }
  updates.push(...live.tick(1e9).map(asPassed));
  const finish = live.finish();
  return {
    updates,
    onPush,
    order,
    finish: {
      ...finish,
      results: finish.results.map((r) => ({ ...r, playedIndex: r.playedIndex === null ? null : order[r.playedIndex] })),
      extras: finish.extras.map((e) => order[e]).sort((x, y) => x - y),
    },
  };
}

describe('scorer fixtures (fixtures/scoring/*.json)', () => {
  it('finds the cases', () => {
    expect(fixtures.length).toBeGreaterThanOrEqual(15);
  });

  for (const f of fixtures) {
    describe(f.name, () => {
      it('scoreTake gives the worked-out score', () => {
        expectScore(scoreTake(f.expected, f.played, f.options), f.score);
      });

      it('the live scorer settles every note to the same result and finishes with the same score', () => {
        const { updates, finish } = playLive(f);
        expectScore(finish, f.score);
        const settled = updates.filter((u) => u.settled);
        const seen = new Set<number>();
        for (const u of settled) {
          expect(seen.has(u.index), `index ${u.index} settled twice`).toBe(false);
          seen.add(u.index);
          expectResult(u.result, f.score.results[u.index], `settled ${u.index}`);
        }
        // timed mode settles everything once the clock passes the last window; free mode may leave the tail to finish()
        if (f.options.mode === 'timed') expect(seen.size).toBe(f.expected.length);
      });

      it('each pushed note gets its mark at once', () => {
        const { onPush, order } = playLive(f);
        order.forEach((k, p) => {
          const index = f.score.results.findIndex((r) => r.playedIndex === k);
          if (index < 0) return; // an extra has no expected note to mark
          expect(
            onPush[p].some((u) => u.index === index && u.result.playedIndex === k),
            `played ${k}`,
          ).toBe(true);
        });
      });
    });
  }
});

describe('live settling in time', () => {
  const f = fixtures.find((x) => x.name === 'perfect');
  it('settles a note as soon as its match window has closed', () => {
    if (!f) throw new Error('perfect fixture missing');
    const { matchWindowMs } = scoringWindows(f.expected, f.options);
    const live = createLiveScorer(f.expected, f.options);
    const first = live.push(f.played[0]);
    expect(first).toEqual([{ index: 0, result: { verdict: 'hit', playedIndex: 0, offsetMs: 0 }, settled: false }]);
    expect(live.tick(matchWindowMs)).toEqual([]); // windows are inclusive: still open
    expect(live.tick(matchWindowMs + 1)).toEqual([{ index: 0, result: first[0].result, settled: true }]);
  });

  it('settles a note nobody played as missed when its window closes', () => {
    if (!f) throw new Error('perfect fixture missing');
    const live = createLiveScorer(f.expected, f.options);
    expect(live.tick(126)).toEqual([
      { index: 0, result: { verdict: 'missed', playedIndex: null, offsetMs: null }, settled: true },
    ]);
  });
});
