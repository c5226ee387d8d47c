import { Interval, Note } from 'tonal';
import type { Quality } from '../types';
import { spelledPc } from './spelling';
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
  return [...triadRead(p.a.root, p.a.quality).notes, ...triadRead(p.b.root, p.b.quality).notes];
}

/** A triad's three names and what the spelling rule counts in them, read with tonal once. */
interface TriadRead {
  notes: string[];
  /** semitones past a single sharp or flat (Ebb counts 1, Fbbb 2) */
  doubles: number;
  /** how many of Cb, Fb, E#, B# */
  awkward: number;
  /** how many notes carry a sharp or flat */
  accidentals: number;
}

const triadCache = new Map<string, TriadRead>();

function triadRead(root: string, quality: Quality): TriadRead {
  const key = `${root} ${quality}`;
  let read = triadCache.get(key);
  if (!read) {
    const notes = TRIAD_INTERVALS[quality].map((iv) => Note.transpose(root, iv));
    const alts = notes.map((n) => spelledPc(n).alt);
    read = {
      notes,
      doubles: alts.reduce((sum, alt) => sum + doublesOf(alt), 0),
      awkward: notes.filter((n) => AWKWARD.has(n)).length,
      accidentals: alts.filter((a) => a !== 0).length,
    };
    triadCache.set(key, read);
  }
  return read;
}

function doublesOf(alt: number): number {
  const a = Math.abs(alt);
  return a > 1 ? a - 1 : 0;
}

/**
 * In order: semitones past a single sharp or flat over all six notes and both roots; a unit or
 * not; Cb, Fb, E#, B# among the roots, then among the notes; accidentals; a's root's place.
 */
function score(p: PairRoots, unit: boolean): number[] {
  const a = triadRead(p.a.root, p.a.quality);
  const b = triadRead(p.b.root, p.b.quality);
  const rootIndex = ROOT_ORDER.indexOf(p.a.root);
  return [
    a.doubles + b.doubles + doublesOf(spelledPc(p.a.root).alt) + doublesOf(spelledPc(p.b.root).alt),
    unit ? 0 : 1,
    (AWKWARD.has(p.a.root) ? 1 : 0) + (AWKWARD.has(p.b.root) ? 1 : 0),
    a.awkward + b.awkward,
    a.accidentals + b.accidentals,
    rootIndex < 0 ? ROOT_ORDER.length : rootIndex,
  ];
}

const transposeCache = new Map<string, string>();

/** Note.transpose, remembered: spelling tries the same few dozen names again and again. */
function transposed(name: string, interval: string): string {
  const key = `${name} ${interval}`;
  let out = transposeCache.get(key);
  if (out === undefined) {
    out = Note.transpose(name, interval);
    transposeCache.set(key, out);
  }
  return out;
}

function respell(p: PairRoots, aInterval: string, bInterval: string): PairRoots {
  return {
    a: { ...p.a, root: aInterval === '1P' ? p.a.root : transposed(p.a.root, aInterval) },
    b: { ...p.b, root: bInterval === '1P' ? p.b.root : transposed(p.b.root, bInterval) },
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
  const key = `${p.a.root} ${p.a.quality}|${p.b.root} ${p.b.quality}`;
  let best = unitCache.get(key);
  if (!best) {
    const found = spellPairUncached(p);
    best = { a: { ...found.a }, b: { ...found.b } };
    unitCache.set(key, best);
  }
  return { a: { ...best.a }, b: { ...best.b } };
}

const unitCache = new Map<string, PairRoots>();

function spellPairUncached(p: PairRoots): PairRoots {
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
