import type { DrillNote, LiveScorer, NoteResult, PlayedNote, ScoreOptions, ScoreUpdate, TakeScore } from '../types';
import { buildGrid, cellOf, type Grid, MOVE_DIAG, MOVE_ORIGIN, MOVE_UP, type Step, traceBack } from './align';
import { checkPlayed, prepareExpected, stepOutcome, summarize } from './prepare';
import { scoreTake } from './score-take';

/**
 * A scorer fed note by note while the player plays. `push` answers at once with a provisional
 * mark for the note (what the alignment so far makes of it) and with whatever it settles;
 * `tick(nowMs)` settles what the passing of time decides. A settled result never changes and
 * equals `finish()`'s, and `finish()` equals `scoreTake` on the same notes.
 *
 * Settle rule. Every note still to come lies at or after the clock (the latest of the last
 * tick and the last pushed note; in free mode, the next position). The final alignment
 * leaves the column of the last known played note from some row whose expected note could
 * still pair with a future note, so it is the traceback of one of those frontier states.
 * Where all their tracebacks meet, everything before the meeting point is final: no note that
 * could still arrive can change it (a point no played note can align across). That prefix is
 * settled and the DP restarts from the meeting point, so each push re-runs only the unsettled
 * suffix. In timed play this settles a note once its match window closes, unless the windows
 * of neighbouring notes overlap and the played notes keep them tied together; in free mode the
 * lag is at most the band (64 notes).
 *
 * Notes must be pushed in time order, and tick(nowMs) promises that no note earlier than nowMs
 * will follow. When that promise is broken the scorer stops settling, keeps giving provisional
 * marks, and finish() falls back to scoring the whole take.
 *
 * @example
 * const live = createLiveScorer(drill.notes, { tempo: 120, mode: 'timed' });
 * live.push({ midi: 65, timeMs: 3 });  // [{ index: 0, result: { verdict: 'hit', ... }, settled: false }]
 * live.tick(200);                      // [{ index: 0, result: ..., settled: true }]
 * live.finish();                       // the same TakeScore scoreTake gives
 */
export function createLiveScorer(expected: DrillNote[], options: ScoreOptions): LiveScorer {
  const prep = prepareExpected(expected, options);
  const d = prep.data;
  const n = d.expTime.length;
  const W = d.win;
  const raw: PlayedNote[] = [];
  // timed notes arrive in time order, so the sorted order is the push order
  const playOrder: number[] = [];
  const settled: (NoteResult | null)[] = new Array(n).fill(null);
  const settledExtras: number[] = [];
  const shown: (string | null)[] = new Array(n).fill(null);
  let a = 0;
  let b = 0;
  let clock = Number.NEGATIVE_INFINITY;
  let k0 = 0;
  let lastKk = -1;
  let rowsWithPlay = 0;
  let broken = false;
  let grid: Grid | null = null;

  const key = (r: NoteResult) => `${r.verdict}|${r.playedIndex}|${r.offsetMs}`;

  function frontierStart(): number {
    const m = d.playTime.length;
    if (d.free) k0 = Math.min(n, Math.max(0, m - W));
    else while (k0 < n && clock - d.expTime[k0] > W) k0++;
    return Math.max(k0, a);
  }

  /** Re-runs the unsettled suffix, settles what the frontier decides, marks the rest. */
  function advance(): ScoreUpdate[] {
    const m = d.playTime.length;
    const kk = frontierStart();
    lastKk = kk;
    const last = m > 0 ? d.playTime[m - 1] : Number.NEGATIVE_INFINITY;
    while (rowsWithPlay < n && d.expTime[rowsWithPlay] - last <= W) rowsWithPlay++;
    const rowEnd = Math.min(n, Math.max(rowsWithPlay, kk, a));
    if (!grid || grid.a !== a || grid.b !== b || grid.m !== m || grid.rowEnd !== rowEnd) {
      grid = buildGrid(d, a, b, rowEnd, m);
    }
    const g = grid;
    // The provisional reading: the frontier state that is cheapest if every expected note the
    // known notes could still reach, and that it leaves open, went unplayed. That makes a wrong
    // note read as wrong at once rather than as an extra with its expected note pending.
    let best = -1;
    let bestP = Number.POSITIVE_INFINITY;
    let bestS = Number.POSITIVE_INFINITY;
    for (let i = kk; i <= rowEnd; i++) {
      const c = cellOf(g, i, m);
      if (c < 0) continue;
      const p = g.prim[c] + 2 * (rowEnd - i);
      if (p < bestP || (p === bestP && g.sec[c] < bestS)) {
        best = i;
        bestP = p;
        bestS = g.sec[c];
      }
    }
    if (best < 0) return [];
    const path = traceBack(g, best, m);
    const pos = new Map<number, number>();
    for (let k = 0; k < path.length; k++) pos.set(cellOf(g, path[k].i, path[k].j), k);
    let meet = 0;
    for (let i = kk; i <= rowEnd; i++) {
      if (i === best || cellOf(g, i, m) < 0) continue;
      let ci = i;
      let cj = m;
      for (;;) {
        const c = cellOf(g, ci, cj);
        const k = pos.get(c);
        if (k !== undefined) {
          if (k > meet) meet = k;
          break;
        }
        const mv = g.move[c];
        if (mv === MOVE_DIAG) {
          ci--;
          cj--;
        } else if (mv === MOVE_UP) ci--;
        else cj--;
      }
    }
    const updates: ScoreUpdate[] = [];
    // path runs from the frontier back to the origin: settle from the origin up to `meet`
    for (let k = path.length - 1; k >= 0; k--) {
      const step: Step = path[k];
      if (step.move === MOVE_ORIGIN) continue;
      const out = stepOutcome(d, step, playOrder);
      if (k >= meet) {
        if (out.exp === null) settledExtras.push(out.played);
        else {
          settled[out.exp] = out.result;
          shown[out.exp] = null;
          updates.push({ index: prep.expOrder[out.exp], result: out.result, settled: true });
        }
      } else if (out.exp !== null) {
        const kNew = key(out.result);
        if (shown[out.exp] !== kNew) {
          shown[out.exp] = kNew;
          updates.push({ index: prep.expOrder[out.exp], result: out.result, settled: false });
        }
      }
    }
    const meetStep = path[meet];
    if (meetStep.i !== a || meetStep.j !== b) {
      a = meetStep.i;
      b = meetStep.j;
      grid = null;
    }
    return updates;
  }

  /** After a broken promise: provisional marks from the whole take, nothing more settled. */
  function fallback(): ScoreUpdate[] {
    const score = scoreTake(expected, raw, options);
    const updates: ScoreUpdate[] = [];
    for (let s = 0; s < n; s++) {
      if (settled[s]) continue;
      const index = prep.expOrder[s];
      const r = score.results[index];
      const kNew = key(r);
      if (shown[s] !== kNew) {
        shown[s] = kNew;
        updates.push({ index, result: r, settled: false });
      }
    }
    return updates;
  }

  return {
    push(note: PlayedNote): ScoreUpdate[] {
      checkPlayed(note);
      raw.push(note);
      if (!d.free && note.timeMs < clock) broken = true;
      if (broken) return fallback();
      playOrder.push(raw.length - 1);
      d.playTime.push(d.free ? raw.length - 1 : note.timeMs);
      d.playPitch.push(note.midi + prep.transposition);
      if (!d.free) clock = note.timeMs;
      return advance();
    },
    tick(nowMs: number): ScoreUpdate[] {
      if (d.free || broken || !(nowMs > clock)) return [];
      clock = nowMs;
      if (frontierStart() === lastKk) return [];
      return advance();
    },
    finish(): TakeScore {
      if (broken) return scoreTake(expected, raw, options);
      const m = d.playTime.length;
      const g = buildGrid(d, a, b, n, m);
      const results: NoteResult[] = new Array(n);
      for (let s = 0; s < n; s++) {
        const r = settled[s];
        if (r) results[prep.expOrder[s]] = r;
      }
      const extras = [...settledExtras];
      for (const step of traceBack(g, n, m)) {
        if (step.move === MOVE_ORIGIN) continue;
        const out = stepOutcome(d, step, playOrder);
        if (out.exp === null) extras.push(out.played);
        else results[prep.expOrder[out.exp]] = out.result;
      }
      return summarize(results, extras);
    },
  };
}
