/**
 * The alignment both scorers share: a global, banded dynamic programme over the time-ordered
 * expected notes (rows) and played notes (columns). State (i, j) means the first i expected and
 * the first j played notes are accounted for. Moves: diagonal (expected i-1 paired with played
 * j-1), up (expected i-1 missed), left (played j-1 extra).
 *
 * Costs are kept in half-units so they stay exact integers: hit 0, early/late 1, wrong 3,
 * missed 2, extra 2. Ties on cost go to the smaller sum of |offset| (integer microseconds in
 * timed mode, positions in free mode), then to the first of diagonal, up, left. Every quantity
 * compared is an exact integer, so a run started from any state on the optimal path reaches the
 * same decisions as a run from the start: that is what lets the live scorer re-run only the
 * unsettled suffix and still agree with the batch scorer.
 *
 * Band: row i holds columns j with s[j-1] <= t[i] + W (the next expected note could still be
 * reached) and s[j] >= t[i-1] - W (the next played note is not already too early for the last
 * expected one). Some optimal alignment always stays inside it (order the unmatched notes
 * between two pairs by time and every state it visits satisfies both), so the band loses
 * nothing, and its width is bounded by how many played notes fall near one expected note:
 * cost grows linearly with the take.
 */

export const HIT = 0;
export const EARLY = 1;
export const LATE = 2;
export const WRONG = 3;

export const MOVE_ORIGIN = 0;
export const MOVE_DIAG = 1;
export const MOVE_UP = 2;
export const MOVE_LEFT = 3;

const PAIR_COST = [0, 1, 1, 3];
const SKIP_COST = 2;

/** Sorted notes and windows, in the units the band works in (ms, or positions in free mode). */
export interface AlignData {
  free: boolean;
  expTime: number[];
  expPitch: number[];
  playTime: number[];
  /** already moved by the input transposition */
  playPitch: number[];
  hit: number;
  win: number;
  octave: boolean;
}

/** The DP over rows a..rowEnd and columns b..m, started at state (a, b). */
export interface Grid {
  a: number;
  b: number;
  rowEnd: number;
  m: number;
  lo: Int32Array;
  hi: Int32Array;
  base: Int32Array;
  prim: Float64Array;
  sec: Float64Array;
  move: Uint8Array;
}

function samePitch(d: AlignData, e: number, p: number): boolean {
  if (e === p) return true;
  return d.octave && (((e - p) % 12) + 12) % 12 === 0;
}

/** Verdict code of pairing expected i with played j (0-based), or -1 outside the match window. */
export function pairCode(d: AlignData, i: number, j: number): number {
  const off = d.playTime[j] - d.expTime[i];
  const abs = Math.abs(off);
  if (off > d.win || -off > d.win) return -1;
  if (!samePitch(d, d.expPitch[i], d.playPitch[j])) return WRONG;
  if (d.free || abs <= d.hit) return HIT;
  return off < 0 ? EARLY : LATE;
}

function pairTie(d: AlignData, i: number, j: number): number {
  const abs = Math.abs(d.playTime[j] - d.expTime[i]);
  return d.free ? abs : Math.round(abs * 1000);
}

/** Runs the DP from (a, b) over rows a..rowEnd and the first m played notes. */
export function buildGrid(d: AlignData, a: number, b: number, rowEnd: number, m: number): Grid {
  const n = d.expTime.length;
  const rows = rowEnd - a + 1;
  const lo = new Int32Array(rows);
  const hi = new Int32Array(rows);
  const base = new Int32Array(rows + 1);
  const S = d.playTime;
  const T = d.expTime;
  const W = d.win;
  let pLo = b;
  let pHi = b;
  for (let r = 0; r < rows; r++) {
    const i = a + r;
    // every window test is written as a difference against W, exactly as pairCode does, so
    // that rounding can never let the band and the pair test disagree
    if (r > 0) {
      const t = T[i - 1];
      while (pLo < m && t - S[pLo] > W) pLo++;
    }
    let h: number;
    if (i >= n) h = m;
    else {
      const t = T[i];
      while (pHi < m && S[pHi] - t <= W) pHi++;
      h = pHi;
    }
    const l = r === 0 ? b : pLo;
    lo[r] = l;
    hi[r] = Math.max(h, l);
    base[r + 1] = base[r] + hi[r] - lo[r] + 1;
  }
  const cells = base[rows];
  const prim = new Float64Array(cells);
  const sec = new Float64Array(cells);
  const move = new Uint8Array(cells);
  for (let r = 0; r < rows; r++) {
    const i = a + r;
    const l = lo[r];
    const h = hi[r];
    const rowBase = base[r];
    const pl = r > 0 ? lo[r - 1] : 0;
    const ph = r > 0 ? hi[r - 1] : -1;
    const prevBase = r > 0 ? base[r - 1] : 0;
    for (let j = l; j <= h; j++) {
      const idx = rowBase + j - l;
      if (r === 0 && j === b) {
        prim[idx] = 0;
        sec[idx] = 0;
        move[idx] = MOVE_ORIGIN;
        continue;
      }
      let bp = Number.POSITIVE_INFINITY;
      let bs = Number.POSITIVE_INFINITY;
      let mv = MOVE_ORIGIN;
      if (r > 0) {
        if (j - 1 >= pl && j - 1 <= ph) {
          const code = pairCode(d, i - 1, j - 1);
          if (code >= 0) {
            const prev = prevBase + j - 1 - pl;
            bp = prim[prev] + PAIR_COST[code];
            bs = sec[prev] + pairTie(d, i - 1, j - 1);
            mv = MOVE_DIAG;
          }
        }
        if (j >= pl && j <= ph) {
          const up = prevBase + j - pl;
          const p = prim[up] + SKIP_COST;
          const s = sec[up];
          if (p < bp || (p === bp && s < bs)) {
            bp = p;
            bs = s;
            mv = MOVE_UP;
          }
        }
      }
      if (j - 1 >= l) {
        const left = idx - 1;
        const p = prim[left] + SKIP_COST;
        const s = sec[left];
        if (p < bp || (p === bp && s < bs)) {
          bp = p;
          bs = s;
          mv = MOVE_LEFT;
        }
      }
      prim[idx] = bp;
      sec[idx] = bs;
      move[idx] = mv;
    }
  }
  return { a, b, rowEnd, m, lo, hi, base, prim, sec, move };
}

/** Flat index of state (i, j), or -1 when it lies outside the grid's band. */
export function cellOf(g: Grid, i: number, j: number): number {
  const r = i - g.a;
  if (r < 0 || i > g.rowEnd) return -1;
  if (j < g.lo[r] || j > g.hi[r]) return -1;
  return g.base[r] + j - g.lo[r];
}

/** One step of a traceback: the move that entered state (i, j). */
export interface Step {
  move: number;
  i: number;
  j: number;
}

/**
 * The path from state (i, j) back to the grid's origin, as steps ordered from (i, j) back:
 * steps[0] is (i, j) itself, the last is the origin.
 */
export function traceBack(g: Grid, i: number, j: number): Step[] {
  const steps: Step[] = [];
  let ci = i;
  let cj = j;
  for (;;) {
    const idx = cellOf(g, ci, cj);
    const mv = g.move[idx];
    steps.push({ move: mv, i: ci, j: cj });
    if (mv === MOVE_ORIGIN) return steps;
    if (mv === MOVE_DIAG) {
      ci--;
      cj--;
    } else if (mv === MOVE_UP) ci--;
    else cj--;
  }
}
