import { Interval, Note } from 'tonal';
import type { Quality } from '../types';
import { QUALITY_SUFFIX } from './triads';

/** A pair given by its two roots and qualities; roots are pitch-class names ("F#", "Eb"). */
export interface PairRoots {
  a: { root: string; quality: Quality };
  b: { root: string; quality: Quality };
}

const TRIAD_INTERVALS: Record<Quality, string[]> = {
  major: ['1P', '3M', '5P'],
  minor: ['1P', '3m', '5P'],
  diminished: ['1P', '3m', '5d'],
  augmented: ['1P', '3M', '5A'],
};

/** Cb, Fb, E# and B#: names a reader takes longer to read than their neighbours. */
const AWKWARD = new Set(['Cb', 'Fb', 'E#', 'B#']);
const ROOT_ORDER = ['C', 'Db', 'D', 'Eb', 'E', 'F', 'F#', 'G', 'Ab', 'A', 'Bb', 'B'];

/**
 * The six pitch-class names of a pair, a's three then b's, spelled from each root by tonal.
 *
 * @example
 * pairNotes({ a: { root: 'F', quality: 'major' }, b: { root: 'Eb', quality: 'major' } })
 * // ['F', 'A', 'C', 'Eb', 'G', 'Bb']
 */
export function pairNotes(p: PairRoots): string[] {
  const notes: string[] = [];
  for (const t of [p.a, p.b]) {
    for (const iv of TRIAD_INTERVALS[t.quality]) notes.push(Note.transpose(t.root, iv));
  }
  return notes;
}

/** Semitones past a single sharp or flat, over all six notes and both roots (Ebb counts 1, Fbbb 2). */
function doubles(p: PairRoots): number {
  let n = 0;
  for (const name of [...pairNotes(p), p.a.root, p.b.root]) {
    const alt = Math.abs(Note.get(name).alt);
    if (alt > 1) n += alt - 1;
  }
  return n;
}

function score(p: PairRoots, unit: boolean): number[] {
  const notes = pairNotes(p);
  const roots = [p.a.root, p.b.root];
  const alts = notes.map((n) => Note.get(n).alt);
  const rootIndex = ROOT_ORDER.indexOf(p.a.root);
  return [
    doubles(p),
    unit ? 0 : 1,
    roots.filter((r) => AWKWARD.has(r)).length,
    notes.filter((n) => AWKWARD.has(n)).length,
    alts.filter((a) => a !== 0).length,
    rootIndex < 0 ? ROOT_ORDER.length : rootIndex,
  ];
}

function respell(p: PairRoots, aInterval: string, bInterval: string): PairRoots {
  return {
    a: { ...p.a, root: aInterval === '1P' ? p.a.root : Note.transpose(p.a.root, aInterval) },
    b: { ...p.b, root: bInterval === '1P' ? p.b.root : Note.transpose(p.b.root, bInterval) },
  };
}

const SHIFTS = ['1P', '2d', '-2d'];

/**
 * Spells a pair as one unit: the pair as given, or its enharmonic respelling with every note
 * moved by a diminished second (up or down, all the same way), whichever reads best. In
 * order: no double sharp or flat; fewer of Cb, Fb, E#, B# among the roots, then among all six
 * notes; fewer accidentals; a's root earlier in C Db D Eb E F F# G Ab A Bb B. Ties keep the
 * pair as given. Intervals between any two notes keep their names, so the triads never pull
 * apart (a whole step stays a whole step).
 *
 * A few pairs cannot be spelled as a unit without a double sharp or flat in some keys (Eb with
 * Gbm: its respelling is D# with F##... ); only then is one triad respelled on its own (Eb with
 * F#m), since no double sharp or flat comes first.
 *
 * @example
 * spellPairAsUnit({ a: { root: 'G#', quality: 'major' }, b: { root: 'F#', quality: 'major' } })
 * // { a: { root: 'Ab', quality: 'major' }, b: { root: 'Gb', quality: 'major' } }
 */
export function spellPairAsUnit(p: PairRoots): PairRoots {
  let best = p;
  let bestScore = score(p, true);
  const consider = (c: PairRoots, unit: boolean) => {
    if (c.a.root === '' || c.b.root === '') return;
    const s = score(c, unit);
    const i = s.findIndex((v, k) => v !== bestScore[k]);
    if (i >= 0 && s[i] < bestScore[i]) {
      best = c;
      bestScore = s;
    }
  };
  for (const sh of SHIFTS.slice(1)) consider(respell(p, sh, sh), true);
  if (bestScore[0] > 0) {
    for (const sa of SHIFTS) for (const sb of SHIFTS) if (sa !== sb) consider(respell(p, sa, sb), false);
  }
  return best;
}

/**
 * Moves a pair by an interval (tonal's name, e.g. '6M' or '-2M') and spells the result as a
 * unit: the way a key cycle and a transposing instrument's written part name a pair.
 *
 * @example
 * movePair(['F#', 'E'], '2M') // ['Ab', 'Gb']   (concert F#/E read on a B-flat instrument)
 */
export function movePair(symbols: [string, string], interval: string): [string, string] {
  const key = `${symbols[0]}|${symbols[1]}|${interval}`;
  const hit = moveCache.get(key);
  if (hit) return [hit[0], hit[1]];
  const moved = movePairUncached(symbols, interval);
  moveCache.set(key, moved);
  return [moved[0], moved[1]];
}

const moveCache = new Map<string, [string, string]>();

function movePairUncached(symbols: [string, string], interval: string): [string, string] {
  const parsed = symbols.map(splitSymbol) as [SplitSymbol, SplitSymbol];
  const moved = spellPairAsUnit({
    a: { root: Note.transpose(parsed[0].root, interval), quality: parsed[0].quality },
    b: { root: Note.transpose(parsed[1].root, interval), quality: parsed[1].quality },
  });
  return [moved.a.root + QUALITY_SUFFIX[moved.a.quality], moved.b.root + QUALITY_SUFFIX[moved.b.quality]];
}

/**
 * The simple interval tonal names for a number of semitones up (0..11), on the pair's own
 * terms: the spelling rule above then settles enharmonics, so the name chosen here only has to
 * be a plain one.
 *
 * @example
 * semitoneInterval(9) // '6M'
 */
export function semitoneInterval(semitones: number): string {
  const s = ((semitones % 12) + 12) % 12;
  return Interval.fromSemitones(s);
}

interface SplitSymbol {
  root: string;
  quality: Quality;
}

function splitSymbol(symbol: string): SplitSymbol {
  const m = /^([A-Ga-g](?:#{1,2}|b{1,2})?)(.*)$/.exec(symbol.trim());
  const root = m ? m[1][0].toUpperCase() + m[1].slice(1) : symbol;
  const suffix = m ? m[2] : '';
  const quality = (Object.entries(QUALITY_SUFFIX).find(([, sfx]) => sfx === suffix)?.[0] ?? 'major') as Quality;
  return { root, quality };
}
