import { Interval } from 'tonal';
import { EngineError } from '../errors';
import type { Quality, Triad, TriadPair } from '../types';
import { ROOT_SPELLINGS, chromaOf } from './spelling';
import { parseTriad, triadOn } from './triads';

const ALL_QUALITIES: Quality[] = ['major', 'minor', 'diminished', 'augmented'];

function chromas(t: Triad): number[] {
  return t.pitchClasses.map(chromaOf);
}

function makePair(a: Triad, b: Triad): TriadPair {
  const rootChroma = chromaOf(a.root);
  const notes = [...a.pitchClasses, ...b.pitchClasses];
  const hexatonic = notes
    .map((pc) => ({ pc, up: (chromaOf(pc) - rootChroma + 12) % 12 }))
    .sort((x, y) => x.up - y.up)
    .map((n) => n.pc);
  return { a, b, interval: Interval.distance(a.root, b.root), hexatonic };
}

/**
 * Two triads with no pitch class in common, and the six-note scale they make.
 * Throws EngineError when they share a note (that is not a pair).
 *
 * @example
 * triadPair('Fm', 'Eb').hexatonic // ['F', 'G', 'Ab', 'Bb', 'C', 'Eb']
 */
export function triadPair(a: string, b: string): TriadPair {
  const p = pairOf(a, b);
  return {
    a: { ...p.a, pitchClasses: [...p.a.pitchClasses] },
    b: { ...p.b, pitchClasses: [...p.b.pitchClasses] },
    interval: p.interval,
    hexatonic: [...p.hexatonic],
  };
}

const pairCache = new Map<string, TriadPair>();

/**
 * triadPair, cached and shared: for the engine's own reading only, never handed out.
 *
 * @example
 * pairOf('F', 'Eb') === pairOf('F', 'Eb') // true
 */
export function pairOf(a: string, b: string): TriadPair {
  const key = `${a}|${b}`;
  const hit = pairCache.get(key);
  if (hit) return hit;
  const pair = readPair(a, b);
  pairCache.set(key, pair);
  return pair;
}

function readPair(a: string, b: string): TriadPair {
  const ta = parseTriad(a);
  const tb = parseTriad(b);
  const shared = chromas(ta).filter((c) => chromas(tb).includes(c));
  if (shared.length > 0) {
    throw new EngineError(
      `${ta.symbol} and ${tb.symbol} share a note, so they are not a pair: choose two triads with six different notes.`,
    );
  }
  return makePair(ta, tb);
}

let everyTriad: Triad[] | null = null;

/** Every triad once per note set: 12 roots of major, minor and diminished, 4 augmented. */
function allTriads(): Triad[] {
  if (!everyTriad) {
    everyTriad = [];
    for (const root of ROOT_SPELLINGS) {
      for (const q of ALL_QUALITIES) {
        if (q === 'augmented' && chromaOf(root) > 3) continue;
        everyTriad.push(triadOn(root, q));
      }
    }
  }
  return everyTriad;
}

/**
 * Every unordered pair of triads with no shared note, each once; a is the triad whose root
 * comes first in C Db D Eb E F F# G Ab A Bb B.
 *
 * @example
 * allPairs(['major']).length // 30
 */
export function allPairs(qualities: Quality[] = ALL_QUALITIES): TriadPair[] {
  const triads = allTriads().filter((t) => qualities.includes(t.quality));
  const pairs: TriadPair[] = [];
  for (let i = 0; i < triads.length; i++) {
    for (let j = i + 1; j < triads.length; j++) {
      const a = triads[i];
      const b = triads[j];
      if (chromaOf(a.root) === chromaOf(b.root)) continue;
      const cb = chromas(b);
      if (chromas(a).some((c) => cb.includes(c))) continue;
      pairs.push(makePair(a, b));
    }
  }
  return pairs;
}
