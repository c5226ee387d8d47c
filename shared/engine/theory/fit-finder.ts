import { Chord, Interval, Note, Scale } from 'tonal';
import { EngineError } from '../errors';
import type { ChordFit, NoteRole, Quality, TriadPair } from '../types';
import { CHORD_FAMILIES, familyOf } from './chord-families';
import { type PairRoots, pairNotes, spellPairAsUnit } from './pair-spelling';
import { allPairs, pairOf } from './pairs';
import { chromaOf, spelledPc } from './spelling';
import { QUALITY_SUFFIX } from './triads';

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

/** Names of notes outside the chord's own degrees, by semitones above the chord's root. */
const OTHER_NOTE = ['1', 'b9', '9', '#9', '3', '11', '#11', '5', 'b13', '13', 'b7', '7'];
const TENSIONS = new Set(['b9', '9', '#9', '11', '#11', 'b13', '13']);

/** The tensions an altered dominant names (b9, #9, #11, b13), as semitones above its root. */
const ALT_TENSIONS = [1, 3, 6, 8];

/** Cb, Fb, E# and B#: correct, but slower to read than their neighbours. */
const AWKWARD = new Set(['Cb', 'Fb', 'E#', 'B#']);
const ROOT_ORDER = ['C', 'Db', 'D', 'Eb', 'E', 'F', 'F#', 'G', 'Ab', 'A', 'Bb', 'B'];

const mod12 = (n: number) => ((n % 12) + 12) % 12;

/** Symbols tonal does not read, written the way it does. */
function normalise(symbol: string): string {
  return symbol
    .trim()
    .replace(/m\(maj7\)|m\(M7\)|-\(maj7\)/, 'mMaj7')
    .replace(/\(([^)]*)\)/g, '$1');
}

const altOf = (name: string) => spelledPc(name).alt;

const notesCache = new Map<string, string[]>();
/** pairNotes, cached: the same few hundred spellings come up for every chord. */
function notesOfPair(p: PairRoots): string[] {
  const key = `${p.a.root}${p.a.quality}|${p.b.root}${p.b.quality}`;
  let notes = notesCache.get(key);
  if (!notes) {
    notes = pairNotes(p);
    notesCache.set(key, notes);
  }
  return notes;
}

const hasDouble = (p: PairRoots) => [p.a.root, p.b.root, ...notesOfPair(p)].some((n) => Math.abs(altOf(n)) > 1);

/** A listed pair read once: its six notes as a bitmask of pitch classes (bit c for chroma c). */
interface ListedPair {
  pair: TriadPair;
  mask: number;
  /**
   * Its spellings that can win, worked out the first time a chord's scale holds the pair: those
   * whose keys before the chord's own are the best (the others lose whatever the chord).
   */
  spellings?: Spelling[];
}

let listedPairs: ListedPair[] | null = null;
/** Every pair once, read only here (allPairs builds a fresh list on each call). */
function everyPair(): ListedPair[] {
  listedPairs ??= allPairs().map((pair) => ({ pair, mask: maskOf(pair.hexatonic.map(chromaOf)) }));
  return listedPairs;
}

const maskOf = (chromas: Iterable<number>): number => {
  let mask = 0;
  for (const c of chromas) mask |= 1 << c;
  return mask;
};

/** A name with a double sharp or flat moved to its plainer enharmonic (Bbb -> A). */
function plain(name: string): string {
  return Math.abs(altOf(name)) > 1 ? Note.simplify(name) : name;
}

/** Every name of a pitch class with at most one sharp or flat (1: C#, Db; 0: C, B#). */
function namesOf(chroma: number): string[] {
  const out: string[] = [];
  for (const letter of ['C', 'D', 'E', 'F', 'G', 'A', 'B']) {
    for (const acc of ['', '#', 'b']) {
      if (chromaOf(letter + acc) === chroma) out.push(letter + acc);
    }
  }
  return out;
}

interface ReadChord {
  root: string;
  rootChroma: number;
  /** semitones above the root -> tonal interval, for each tone of the symbol */
  tones: Map<number, string>;
  /** by chroma: the chord's own spelling of that tone, without double accidentals */
  spelled: Names;
}

/** Names by chroma (index 0..11), where a chord or scale has one. */
type Names = Array<string | undefined>;

function readChord(chord: string): ReadChord {
  if (typeof chord !== 'string' || chord.trim() === '') {
    throw new EngineError('Write a chord symbol, such as "F7", "Cm7" or "Ebmaj7".');
  }
  const parsed = Chord.get(normalise(chord));
  if (parsed.empty || !parsed.tonic) {
    throw new EngineError(`"${chord}" is not a chord symbol Sixfold can read (try "F7", "Cm7", "Ebmaj7").`);
  }
  const root = parsed.tonic;
  const rootChroma = chromaOf(root);
  const tones = new Map<number, string>();
  for (const ivl of parsed.intervals) {
    const st = mod12(Interval.semitones(ivl) ?? 0);
    if (!tones.has(st)) tones.set(st, ivl);
  }
  const spelled: Names = [];
  for (const n of parsed.notes) {
    const c = chromaOf(n);
    spelled[c] ??= plain(Note.get(n).pc);
  }
  return { root, rootChroma, tones, spelled };
}

interface UsableScale {
  name: string;
  order: number;
  /** the scale's pitch classes as a bitmask */
  mask: number;
  hasFifth: boolean;
  /** by chroma: the scale's spelling on the chord's root, without double accidentals */
  spelled: Names;
}

/** One way to name a listed pair, with what its score needs worked out once. */
interface Spelling {
  roots: PairRoots;
  notes: string[];
  chromas: number[];
  /** the score's keys that do not depend on the chord: before and after its two chord keys */
  head: number[];
  tail: number[];
  /** the same pair, lower triad first, as handed out */
  lowered?: TriadPair;
}

const rootIndex = (r: string) => (ROOT_ORDER.includes(r) ? ROOT_ORDER.indexOf(r) : ROOT_ORDER.length);

/**
 * The names a listed pair can take: each root under either of its plain names, spelled as a
 * unit where that leaves a double sharp or flat.
 */
function spellingsOf(listed: ListedPair): Spelling[] {
  if (listed.spellings) return listed.spellings;
  const { pair } = listed;
  const spellings: Spelling[] = [];
  for (const a of namesOf(chromaOf(pair.a.root))) {
    for (const b of namesOf(chromaOf(pair.b.root))) {
      const raw = { a: { root: a, quality: pair.a.quality }, b: { root: b, quality: pair.b.quality } };
      // Where a double sharp or flat appears, the pair as a unit is the way out.
      const p = hasDouble(raw) ? spellPairAsUnit(raw) : raw;
      const notes = notesOfPair(p);
      const roots = [p.a.root, p.b.root];
      const alts = [...notes, ...roots].map(altOf);
      const rootAlts = roots.map(altOf);
      spellings.push({
        roots: p,
        notes,
        chromas: notes.map(chromaOf),
        head: [
          alts.some((x) => Math.abs(x) > 1) ? 1 : 0,
          roots.filter((r) => AWKWARD.has(r)).length,
          rootAlts[0] * rootAlts[1] < 0 ? 1 : 0,
        ],
        tail: [
          notes.filter((n) => AWKWARD.has(n)).length,
          notes.filter((n) => altOf(n) !== 0).length,
          rootIndex(p.a.root),
          rootIndex(p.b.root),
        ],
      });
    }
  }
  const best = spellings.reduce((b, s) => (compare(s.head, b.head) < 0 ? s : b)).head;
  listed.spellings = spellings.filter((s) => compare(s.head, best) === 0);
  return listed.spellings;
}

/** Lexicographic order of two lists of keys of the same length (negative: x first). */
function compare(x: number[], y: number[]): number {
  for (let k = 0; k < x.length; k++) if (x[k] !== y[k]) return x[k] - y[k];
  return 0;
}

/** Notes of a spelling that the given names spell otherwise; with `onlyNamed`, notes they leave out do not count. */
function misspelt(s: Spelling, names: Names, onlyNamed: boolean): number {
  let n = 0;
  for (let i = 0; i < s.notes.length; i++) {
    const own = names[s.chromas[i]];
    if (own === undefined ? !onlyNamed : own !== s.notes[i]) n++;
  }
  return n;
}

/**
 * The pair named to read best beside the chord. Candidates: each root under either of its plain
 * names, spelled as a unit where that leaves a double sharp or flat. Kept, in order: no double sharp or flat; fewer of
 * Cb, Fb, E#, B# among the roots; roots that do not pull opposite ways (one sharp, one flat, as
 * Ab/A# would); more of the chord's tones spelled as the chord spells them;
 * more notes spelled as the scale does on the chord's root; fewer of those four names among all
 * six notes; fewer accidentals; roots earlier in C Db D Eb ... B.
 */
function spellForChord(listed: ListedPair, chord: ReadChord, scale: UsableScale): Spelling {
  const candidates = spellingsOf(listed);
  let best = candidates[0];
  if (candidates.length === 1) return best;
  // The candidates left share their first keys: the chord's two decide, then the last ones.
  let bestChord = misspelt(best, chord.spelled, true);
  let bestScale = misspelt(best, scale.spelled, false);
  for (let c = 1; c < candidates.length; c++) {
    const s = candidates[c];
    const byChord = misspelt(s, chord.spelled, true);
    const byScale = misspelt(s, scale.spelled, false);
    const order = byChord - bestChord || byScale - bestScale || compare(s.tail, best.tail);
    if (order < 0) {
      best = s;
      bestChord = byChord;
      bestScale = byScale;
    }
  }
  return best;
}

/** The lower triad first: a is the one from whose root the other's lies less than a tritone up. */
function lowerFirst(p: PairRoots): PairRoots {
  const up = mod12(chromaOf(p.b.root) - chromaOf(p.a.root));
  return up > 6 ? { a: p.b, b: p.a } : p;
}

const symbolOf = (t: { root: string; quality: Quality }) => t.root + QUALITY_SUFFIX[t.quality];

interface Candidate {
  fit: Omit<ChordFit, 'rank'>;
  keys: number[];
}

/**
 * Pairs whose six notes sit in a usual scale of the chord (common practice), each once with the
 * first such scale, each note's function and spelling against the chord, best first: the
 * tensions the symbol names, the plain sound before the altered one, two major triads a whole
 * step apart, the chord's guide tones, major and minor triads, the scale's place in the table,
 * then a's root counted up from the chord's. A dominant's perfect fifth is free: its fits found
 * only through the whole tone or altered scale carry `altered: true`.
 *
 * @example
 * pairsForChord('D7')[0].pair.a.symbol // 'C'  (C/D, D mixolydian)
 * pairsForChord('D7').find((f) => f.pair.a.symbol === 'Ab')?.altered // true
 */
export function pairsForChord(chord: string): ChordFit[] {
  const key = typeof chord === 'string' ? chord.trim() : '';
  let fits = fitCache.get(key);
  if (!fits) {
    fits = findFits(chord);
    if (fitCache.size >= 500) fitCache.clear();
    fitCache.set(key, fits);
  }
  return fits.map(copyFit);
}

/** Answers already worked out, by symbol: progressions ask for the same few chords again and again. */
const fitCache = new Map<string, ChordFit[]>();

function copyFit(f: ChordFit): ChordFit {
  const { pair } = f;
  return {
    ...f,
    pair: {
      ...pair,
      a: { ...pair.a, pitchClasses: [...pair.a.pitchClasses] },
      b: { ...pair.b, pitchClasses: [...pair.b.pitchClasses] },
      hexatonic: [...pair.hexatonic],
    },
    functions: [...f.functions],
    notes: [...f.notes],
    roles: [...f.roles],
  };
}

/** A scale on a spelled root as tonal reads it, once per root and scale name. */
interface ScaleRead {
  mask: number;
  /** by chroma: the scale's spelling, without double accidentals */
  spelled: Names;
}

const scaleCache = new Map<string, ScaleRead>();

function scaleOn(root: string, name: string): ScaleRead {
  const key = `${root} ${name}`;
  let read = scaleCache.get(key);
  if (!read) {
    const notes = Scale.get(key).notes;
    const spelled: Names = [];
    for (const n of notes) spelled[chromaOf(n)] = plain(n);
    read = { mask: maskOf(notes.map(chromaOf)), spelled };
    scaleCache.set(key, read);
  }
  return read;
}

const holds = (mask: number, chroma: number) => (mask & (1 << chroma)) !== 0;

/** The spelling as handed out: lower triad first, read as a pair. */
function loweredPair(s: Spelling): TriadPair {
  if (!s.lowered) {
    const p = lowerFirst(s.roots);
    s.lowered = pairOf(symbolOf(p.a), symbolOf(p.b));
  }
  return s.lowered;
}

function findFits(chord: string): ChordFit[] {
  const read = readChord(chord);
  const { root, rootChroma, tones } = read;
  const family = familyOf((st) => tones.has(st));
  if (!family) {
    throw new EngineError(`Sixfold has no usual scales for "${chord}" yet: try a triad, a sixth or seventh chord.`);
  }
  const dominant = family === 'dominant';
  const holdsFifth = tones.get(7) === '5P';
  // A dominant's perfect fifth is free (common practice): scales need not hold it.
  const required = [...tones.keys()].filter((st) => !(dominant && st === 7 && holdsFifth));

  const scales: UsableScale[] = [];
  CHORD_FAMILIES[family].scales.forEach((name, order) => {
    const { mask, spelled } = scaleOn(root, name);
    if (!required.every((st) => holds(mask, mod12(rootChroma + st)))) return;
    scales.push({ name, order, mask, hasFifth: holds(mask, mod12(rootChroma + 7)), spelled });
  });

  const intervals = [...tones.values()].map((ivl) => Interval.get(ivl));
  const named = /alt/i.test(chord)
    ? ALT_TENSIONS
    : intervals.filter((i) => i.num >= 9).map((i) => mod12(i.semitones ?? 0));
  const third = intervals.filter((i) => i.num === 3 || (i.num === 4 && !intervals.some((j) => j.num === 3)));
  const seventh = intervals.filter((i) => i.num === 7);
  const guides = [...third, ...(seventh.length > 0 ? seventh : intervals.filter((i) => i.num === 6))].map((i) =>
    mod12(i.semitones ?? 0),
  );
  const heldCount = (mask: number, sts: number[]) => sts.filter((st) => holds(mask, mod12(rootChroma + st))).length;

  const found: Candidate[] = [];
  for (const listed of everyPair()) {
    let scale: UsableScale | undefined;
    let anyFifth = false;
    for (const s of scales) {
      if ((listed.mask & ~s.mask) !== 0) continue;
      scale ??= s;
      anyFifth ||= s.hasFifth;
    }
    if (!scale) continue;
    const altered = dominant && holdsFifth && !anyFifth;

    const pair = loweredPair(spellForChord(listed, read, scale));
    const notes: string[] = [];
    const functions: string[] = [];
    const roles: NoteRole[] = [];
    for (const pc of pair.hexatonic) {
      const c = chromaOf(pc);
      const st = mod12(c - rootChroma);
      const degree = CHORD_DEGREE[tones.get(st) ?? ''];
      const fn = degree ?? OTHER_NOTE[st];
      notes.push(read.spelled[c] ?? scale.spelled[c] ?? plain(pc));
      functions.push(fn);
      roles.push(degree ? 'chord-tone' : TENSIONS.has(fn) ? 'tension' : 'other');
    }

    const qualities = [pair.a.quality, pair.b.quality];
    const wholeStep = mod12(chromaOf(pair.b.root) - chromaOf(pair.a.root));
    found.push({
      fit: { pair, scale: scale.name, functions, altered, notes, roles },
      keys: [
        -heldCount(listed.mask, named),
        named.length === 0 && altered ? 1 : 0,
        qualities.every((q) => q === 'major') && (wholeStep === 2 || wholeStep === 10) ? 0 : 1,
        -heldCount(listed.mask, guides),
        qualities.every((q) => q === 'major' || q === 'minor') ? 0 : 1,
        scale.order,
        mod12(chromaOf(pair.a.root) - rootChroma),
        mod12(chromaOf(pair.b.root) - rootChroma),
      ],
    });
  }
  found.sort((x, y) => {
    const i = x.keys.findIndex((v, k) => v !== y.keys[k]);
    return i < 0 ? 0 : x.keys[i] - y.keys[i];
  });
  return found.map((f, i) => ({ ...f.fit, rank: i + 1 }));
}
