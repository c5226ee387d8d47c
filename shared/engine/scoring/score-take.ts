import type { DrillNote, NoteResult, PlayedNote, ScoreOptions, TakeScore } from '../types';
import { buildGrid, MOVE_ORIGIN, traceBack } from './align';
import { checkPlayed, prepareExpected, stepOutcome, summarize } from './prepare';

/**
 * Scores a whole take against the drill's notes: the globally cheapest alignment (hit 0,
 * early/late 0.5, wrong 1.5, missed 1, extra 1), never a greedy nearest match. Timed mode
 * sorts a copy of `played` by time; free mode keeps the order given. `playedIndex` and `extras`
 * index `played` as passed.
 *
 * @example
 * const score = scoreTake(drill.notes, [{ midi: 65, timeMs: 4 }], { tempo: 120, mode: 'timed' });
 * score.results[0] // { verdict: 'hit', playedIndex: 0, offsetMs: 4 }
 */
export function scoreTake(expected: DrillNote[], played: PlayedNote[], options: ScoreOptions): TakeScore {
  const prep = prepareExpected(expected, options);
  const d = prep.data;
  played.forEach(checkPlayed);
  const playOrder = played.map((_, k) => k);
  if (!d.free) playOrder.sort((x, y) => played[x].timeMs - played[y].timeMs || x - y);
  d.playTime = playOrder.map((k, pos) => (d.free ? pos : played[k].timeMs));
  d.playPitch = playOrder.map((k) => played[k].midi + prep.transposition);
  const n = d.expTime.length;
  const m = d.playTime.length;
  const grid = buildGrid(d, 0, 0, n, m);
  const results: NoteResult[] = new Array(n);
  const extras: number[] = [];
  for (const step of traceBack(grid, n, m)) {
    if (step.move === MOVE_ORIGIN) continue;
    const out = stepOutcome(d, step, playOrder);
    if (out.exp === null) extras.push(out.played);
    else results[prep.expOrder[out.exp]] = out.result;
  }
  return summarize(results, extras);
}
