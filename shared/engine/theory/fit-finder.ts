import { Chord, Interval, Scale } from 'tonal';
import { EngineError } from '../errors';
import type { ChordFit, TriadPair } from '../types';
import { CHORD_FAMILIES, familyOf } from './chord-families';
import { allPairs } from './pairs';
import { chromaOf } from './spelling';

/** Chord degree names by tonal interval, for notes of the chord symbol itself. */
const CHORD_DEGREE: Record<string, string> = {
  '1P': '1',
  '3m': 'b3',
  '3M': '3',
  '5d': 'b5',
  '5P': '5',
  '5A': '#5',
  '6M': '6',
  '7d': 'bb7',
  '7m': 'b7',
  '7M': '7',
};

/** Names of notes outside the chord symbol, by semitones above the chord's root. */
const OTHER_NOTE = ['1', 'b9', '9', '#9', '3', '11', '#11', '5', 'b13', '13', 'b7', '7'];

/** Symbols tonal does not read, written the way it does. */
function normalise(symbol: string): string {
  return symbol
    .trim()
    .replace(/m\(maj7\)|m\(M7\)|-\(maj7\)/, 'mMaj7')
    .replace(/\(([^)]*)\)/g, '$1');
}

function functionOf(semitones: number, chordTones: Map<number, string>): string {
  const inChord = chordTones.get(semitones);
  if (inChord && CHORD_DEGREE[inChord]) return CHORD_DEGREE[inChord];
  return OTHER_NOTE[semitones];
}

/**
 * Pairs whose six notes sit in a usual scale of the chord, each with the first such scale, each
 * note's function against the chord and a rank (pairs holding the chord's third and seventh first).
 *
 * @example
 * pairsForChord('F7').find((f) => f.pair.a.symbol === 'Eb' && f.pair.b.symbol === 'F')?.scale // 'mixolydian'
 */
export function pairsForChord(chord: string): ChordFit[] {
  if (typeof chord !== 'string' || chord.trim() === '') {
    throw new EngineError('Write a chord symbol, such as "F7", "Cm7" or "Ebmaj7".');
  }
  const parsed = Chord.get(normalise(chord));
  if (parsed.empty || !parsed.tonic) {
    throw new EngineError(`"${chord}" is not a chord symbol Sixfold can read (try "F7", "Cm7", "Ebmaj7").`);
  }
  const root = parsed.tonic;
  const rootChroma = chromaOf(root);
  const chordTones = new Map<number, string>();
  for (const ivl of parsed.intervals) {
    const st = (((Interval.semitones(ivl) ?? 0) % 12) + 12) % 12;
    if (!chordTones.has(st)) chordTones.set(st, ivl);
  }
  const family = familyOf((st) => chordTones.has(st));
  if (!family) {
    throw new EngineError(`Sixfold has no usual scales for "${chord}" yet: try a triad, a sixth or seventh chord.`);
  }
  // Guide tones: the third (or fourth of a sus chord) and the seventh (or sixth when none).
  const guides = [3, 4, 5, 10, 11].filter((st) => chordTones.has(st));
  if (!chordTones.has(10) && !chordTones.has(11) && chordTones.has(9)) guides.push(9);

  const scales = CHORD_FAMILIES[family].scales
    .map((name) => ({ name, set: new Set(Scale.get(`${root} ${name}`).notes.map(chromaOf)) }))
    .filter((s) => [...chordTones.keys()].every((st) => s.set.has((rootChroma + st) % 12)));

  const found: { pair: TriadPair; scale: number; guides: boolean; order: number }[] = [];
  allPairs().forEach((pair, order) => {
    const notes = pair.hexatonic.map(chromaOf);
    const scale = scales.findIndex((s) => notes.every((c) => s.set.has(c)));
    if (scale < 0) return;
    const held = new Set(notes.map((c) => (c - rootChroma + 12) % 12));
    found.push({ pair, scale, guides: guides.every((g) => held.has(g)), order });
  });
  found.sort((x, y) => Number(y.guides) - Number(x.guides) || x.scale - y.scale || x.order - y.order);
  return found.map((f, i) => ({
    pair: f.pair,
    scale: scales[f.scale].name,
    functions: f.pair.hexatonic.map((pc) => functionOf((chromaOf(pc) - rootChroma + 12) % 12, chordTones)),
    rank: i + 1,
  }));
}
