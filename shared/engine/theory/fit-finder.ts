import { Chord, Interval, Note, Scale } from 'tonal';
import { EngineError } from '../errors';
import type { ChordFit, NoteRole, Quality, TriadPair } from '../types';
import { CHORD_FAMILIES, familyOf } from './chord-families';
import { type PairRoots, pairNotes, spellPairAsUnit } from './pair-spelling';
import { allPairs, triadPair } from './pairs';
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

let listedPairs: TriadPair[] | null = null;
/** Every pair once, read only here (allPairs builds a fresh list on each call). */
function everyPair(): TriadPair[] {
  listedPairs ??= allPairs();
  return listedPairs;
}

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
  /** chroma -> the chord's own spelling of that tone, without double accidentals */
  spelled: Map<number, string>;
}

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
  const spelled = new Map<number, string>();
  for (const n of parsed.notes) {
    const c = chromaOf(n);
    if (!spelled.has(c)) spelled.set(c, plain(Note.get(n).pc));
  }
  return { root, rootChroma, tones, spelled };
}

interface UsableScale {
  name: string;
  order: number;
  chromas: Set<number>;
  hasFifth: boolean;
  /** chroma -> the scale's spelling on the chord's root, without double accidentals */
  spelled: Map<number, string>;
}

/**
 * The pair named to read best beside the chord. Candidates: each root under either of its plain
 * names, spelled as a unit where that leaves a double sharp or flat. Kept, in order: no double sharp or flat; fewer of
 * Cb, Fb, E#, B# among the roots; roots that do not pull opposite ways (one sharp, one flat, as
 * Ab/A# would); more of the chord's tones spelled as the chord spells them;
 * more notes spelled as the scale does on the chord's root; fewer of those four names among all
 * six notes; fewer accidentals; roots earlier in C Db D Eb ... B.
 */
function spellForChord(pair: TriadPair, chord: ReadChord, scale: UsableScale): PairRoots {
  const candidates: PairRoots[] = [];
  for (const a of namesOf(chromaOf(pair.a.root))) {
    for (const b of namesOf(chromaOf(pair.b.root))) {
      const raw = { a: { root: a, quality: pair.a.quality }, b: { root: b, quality: pair.b.quality } };
      // Where a double sharp or flat appears, the pair as a unit is the way out.
      candidates.push(hasDouble(raw) ? spellPairAsUnit(raw) : raw);
    }
  }
  const score = (p: PairRoots): number[] => {
    const notes = notesOfPair(p);
    const roots = [p.a.root, p.b.root];
    const alts = [...notes, ...roots].map(altOf);
    const rootAlts = roots.map(altOf);
    const rootIndex = (r: string) => (ROOT_ORDER.includes(r) ? ROOT_ORDER.indexOf(r) : ROOT_ORDER.length);
    return [
      alts.some((x) => Math.abs(x) > 1) ? 1 : 0,
      roots.filter((r) => AWKWARD.has(r)).length,
      rootAlts[0] * rootAlts[1] < 0 ? 1 : 0,
      notes.filter((n) => {
        const own = chord.spelled.get(chromaOf(n));
        return own !== undefined && own !== n;
      }).length,
      notes.filter((n) => scale.spelled.get(chromaOf(n)) !== n).length,
      notes.filter((n) => AWKWARD.has(n)).length,
      notes.filter((n) => altOf(n) !== 0).length,
      rootIndex(p.a.root),
      rootIndex(p.b.root),
    ];
  };
  let best = candidates[0];
  let bestScore = score(best);
  for (const c of candidates.slice(1)) {
    const s = score(c);
    const i = s.findIndex((v, k) => v !== bestScore[k]);
    if (i >= 0 && s[i] < bestScore[i]) {
      best = c;
      bestScore = s;
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
    const notes = Scale.get(`${root} ${name}`).notes;
    const chromas = new Set(notes.map(chromaOf));
    if (!required.every((st) => chromas.has(mod12(rootChroma + st)))) return;
    const spelled = new Map(notes.map((n) => [chromaOf(n), plain(n)] as const));
    scales.push({ name, order, chromas, hasFifth: chromas.has(mod12(rootChroma + 7)), spelled });
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

  const found: Candidate[] = [];
  for (const listed of everyPair()) {
    const held = listed.hexatonic.map((pc) => mod12(chromaOf(pc) - rootChroma));
    const holding = scales.filter((s) => listed.hexatonic.every((pc) => s.chromas.has(chromaOf(pc))));
    if (holding.length === 0) continue;
    const scale = holding[0];
    const altered = dominant && holdsFifth && !holding.some((s) => s.hasFifth);

    const spelled = lowerFirst(spellForChord(listed, read, scale));
    const pair = triadPair(symbolOf(spelled.a), symbolOf(spelled.b));
    const notes: string[] = [];
    const functions: string[] = [];
    const roles: NoteRole[] = [];
    for (const pc of pair.hexatonic) {
      const st = mod12(chromaOf(pc) - rootChroma);
      const degree = CHORD_DEGREE[tones.get(st) ?? ''];
      const fn = degree ?? OTHER_NOTE[st];
      notes.push(read.spelled.get(chromaOf(pc)) ?? scale.spelled.get(chromaOf(pc)) ?? plain(pc));
      functions.push(fn);
      roles.push(degree ? 'chord-tone' : TENSIONS.has(fn) ? 'tension' : 'other');
    }

    const qualities = [pair.a.quality, pair.b.quality];
    const wholeStep = mod12(chromaOf(pair.b.root) - chromaOf(pair.a.root));
    found.push({
      fit: { pair, scale: scale.name, functions, altered, notes, roles },
      keys: [
        -named.filter((st) => held.includes(st)).length,
        named.length === 0 && altered ? 1 : 0,
        qualities.every((q) => q === 'major') && (wholeStep === 2 || wholeStep === 10) ? 0 : 1,
        -guides.filter((st) => held.includes(st)).length,
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
