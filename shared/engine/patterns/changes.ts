import { Chord } from 'tonal';
import { EngineError } from '../errors';
import { instruments } from '../instruments';
import { pairsForChord } from '../theory/fit-finder';
import { movePair, semitoneInterval } from '../theory/pair-spelling';
import { pairOf } from '../theory/pairs';
import { chromaOf, rootSpelling } from '../theory/spelling';
import type {
  ChordChange,
  Drill,
  DrillChange,
  DrillNote,
  DrillSpec,
  FilledDrillSpec,
  PatternDef,
  TriadCellDef,
} from '../types';
import type { Ladders } from './cells';
import { defaultStart, laddersFor, snapStart, startLadder } from './start';
import type { Ladder } from './ladder';
import { checkDirection, resolveInstrument, resolveMeter, resolvePattern, resolveRange, resolveTempo } from './spec';
import { checkMeterFits, measureLength, measuresFor, noteLength, tidy } from './timing';

/** Limits that keep a progression drill a drill: a tune's form, a few times through. */
export const MAX_CHORDS = 96;
export const MAX_CHORUSES = 16;
export const MAX_CHORD_BEATS = 64;
const MAX_NOTES = 12_000;
/** Fits a chord's pair is chosen among, when it is not pinned. */
const CHOICES = 3;
const EPS = 1e-9;
const LEAP = [0, 2, 1, 0];

const fitCache = new Map<string, [string, string][]>();

/**
 * The pairs a chord's pair is chosen among: its first three fits, best first (cached, since a
 * blues asks for the same chords many times).
 *
 * @example
 * candidatePairs('D7')[0] // ['C', 'D'] or the fit finder's first fit
 */
export function candidatePairs(chord: string): [string, string][] {
  const hit = fitCache.get(chord);
  if (hit) return hit;
  const fits = pairsForChord(chord);
  if (fits.length === 0) throw new EngineError(`No pair fits "${chord}" yet: pin a pair to it.`);
  const pairs = fits.slice(0, CHOICES).map((f) => [f.pair.a.symbol, f.pair.b.symbol] as [string, string]);
  fitCache.set(chord, pairs);
  return pairs;
}

const maskCache = new Map<string, number>();

/** A pair's pitch classes as a 12-bit mask (cached). */
function pairMask(pair: [string, string]): number {
  const key = `${pair[0]}|${pair[1]}`;
  let mask = maskCache.get(key);
  if (mask === undefined) {
    mask = 0;
    for (const pc of pairOf(pair[0], pair[1]).hexatonic) mask |= 1 << chromaOf(pc);
    maskCache.set(key, mask);
  }
  return mask;
}

/** Semitones between a MIDI note and the nearest tone of a pair, in any octave. */
function distanceToPair(pair: [string, string], midi: number): number {
  const mask = pairMask(pair);
  const c = midi % 12;
  for (let d = 0; d <= 6; d++) {
    if (mask & (1 << ((c + d) % 12)) || mask & (1 << ((c - d + 12) % 12))) return d;
  }
  return 12;
}

/**
 * A chord's pair when it is not pinned: the first fit for the drill's first chord, else the one
 * among the first three fits whose tone nearest the last note played is closest to it (ties go
 * to the better fit), so the line moves smoothly from one pair to the next.
 *
 * @example
 * choosePair('G7', 62) // the fit of G7 with a tone nearest D4
 */
export function choosePair(chord: string, last: number | null): [string, string] {
  const pairs = candidatePairs(chord);
  if (last === null) return pairs[0];
  let best = pairs[0];
  let bestDist = distanceToPair(best, last);
  for (const p of pairs.slice(1)) {
    const d = distanceToPair(p, last);
    if (d < bestDist) {
      best = p;
      bestDist = d;
    }
  }
  return best;
}

function checkChanges(changes: unknown, choruses: unknown, perBeat: number): { list: ChordChange[]; times: number } {
  if (!Array.isArray(changes) || changes.length === 0) {
    throw new EngineError('A progression needs at least one chord, such as Dm7 for 4 beats.');
  }
  if (changes.length > MAX_CHORDS) throw new EngineError(`A progression holds at most ${MAX_CHORDS} chords.`);
  const times = choruses ?? 1;
  if (!Number.isInteger(times) || (times as number) < 1 || (times as number) > MAX_CHORUSES) {
    throw new EngineError(`Play the progression 1 to ${MAX_CHORUSES} times (choruses).`);
  }
  const list = changes.map((c, i): ChordChange => {
    const where = `Chord ${i + 1}`;
    if (!c || typeof c !== 'object' || typeof c.chord !== 'string' || c.chord.trim() === '') {
      throw new EngineError(`${where} needs a chord symbol, such as "Dm7".`);
    }
    const chord = c.chord.trim();
    const beats = c.beats;
    if (typeof beats !== 'number' || !Number.isFinite(beats) || beats <= 0 || beats > MAX_CHORD_BEATS) {
      throw new EngineError(`${where} (${chord}) lasts a number of beats above 0 and at most ${MAX_CHORD_BEATS}.`);
    }
    if (Math.abs(beats * perBeat - Math.round(beats * perBeat)) > EPS) {
      throw new EngineError(
        `${where} (${chord}) lasts ${beats} beats, which this pattern's notes cannot fill exactly: give it a whole number of beats.`,
      );
    }
    candidatePairs(chord); // an unknown symbol fails here, named in the message
    const out: ChordChange = { chord, beats };
    if (c.pair !== undefined) {
      if (!Array.isArray(c.pair) || c.pair.length !== 2 || c.pair.some((s: unknown) => typeof s !== 'string')) {
        throw new EngineError(`${where} (${chord}): a pinned pair is two triad symbols, such as ["D", "C"].`);
      }
      pairOf(c.pair[0], c.pair[1]);
      out.pair = [c.pair[0], c.pair[1]];
    }
    return out;
  });
  return { list, times: times as number };
}

/** The mirrored entry of a cell that starts a chord: above or below the last note, in its own pair. */
function chordEntry(def: TriadCellDef): 'above' | 'below' {
  return def.entry === 'below' ? 'below' : 'above';
}

interface LineState {
  /** +1 going up, -1 going down */
  dir: 1 | -1;
  last: number;
  /** ladder index of each triad's previous entry in the current pair, -1 when none */
  prevEntry: { a: number; b: number };
  lastEntryMidi: number;
  lastEntryPos: number;
  /** the scale pattern's base: index into the six-note scale */
  base: number;
}

interface CellNote {
  lad: Ladder;
  idx: number;
  triad: 'a' | 'b';
}

/** The entry index of a triad cell, or -1 when there is none that way. */
function triadEntry(def: TriadCellDef, lad: Ladder, st: LineState, dir: 1 | -1, fresh: boolean): number {
  let entry: TriadCellDef['entry'] = fresh ? chordEntry(def) : def.entry;
  if (entry === 'next-position' && st.prevEntry[def.triad] < 0) entry = 'above';
  const down = dir < 0;
  switch (entry) {
    case 'start':
    case 'above':
      return down ? lad.below[st.last] : lad.above[st.last];
    case 'below':
      return down ? lad.above[st.last] : lad.below[st.last];
    case 'next-position':
      return st.prevEntry[def.triad] + dir;
    default: {
      const up = st.lastEntryMidi + ((((lad.chroma[st.lastEntryPos] - st.lastEntryMidi) % 12) + 12) % 12);
      const below = up - 12;
      const m =
        up - st.lastEntryMidi < st.lastEntryMidi - below ||
        (up - st.lastEntryMidi === st.lastEntryMidi - below && !down)
          ? up
          : below;
      return m >= 0 && m < 128 ? lad.indexOf[m] : -1;
    }
  }
}

/** The first `count` notes of a triad cell entering at `e`, or null when one leaves the range. */
function triadNotes(
  def: TriadCellDef,
  lad: Ladder,
  e: number,
  dir: 1 | -1,
  count: number,
  low: number,
  high: number,
): CellNote[] | null {
  if (e < 0 || e >= lad.midi.length) return null;
  const motion = (def.motion === 'up' ? 1 : -1) * dir;
  const out: CellNote[] = [];
  for (let i = 0; i < count; i++) {
    const idx = e + motion * (def.shape === 'line' ? i : LEAP[i]);
    const m = idx >= 0 && idx < lad.midi.length ? lad.midi[idx] : -1;
    if (m < low || m > high) return null;
    out.push({ lad, idx, triad: def.triad });
  }
  return out;
}

/** The six-note scale's index of the closest tone strictly above (dir 1) or below (dir -1) a note. */
function hexBeyond(ladders: Ladders, midi: number, dir: 1 | -1): number {
  for (let m = midi + dir; m >= 0 && m < 128; m += dir) {
    if (ladders.hexIndexOf[m] >= 0) return ladders.hexIndexOf[m];
  }
  return -1;
}

function scaleNotes(
  def: Extract<PatternDef, { source: 'scale' }>,
  ladders: Ladders,
  base: number,
  dir: 1 | -1,
  count: number,
  low: number,
  high: number,
): CellNote[] | null {
  if (base < 0) return null;
  const out: CellNote[] = [];
  for (let i = 0; i < count; i++) {
    const at = base + dir * def.degrees[i];
    const h = at >= 0 && at < ladders.hex.length ? ladders.hex[at] : null;
    if (!h || h.midi < low || h.midi > high) return null;
    out.push({ lad: ladders[h.triad], idx: h.idx, triad: h.triad });
  }
  return out;
}

/**
 * The cell entering on the tone nearest `last` (not `last` itself when another will do) from
 * which its first `count` notes fit the range; ties go to the side the line now moves to.
 */
function nearestFit(
  def: PatternDef,
  ladders: Ladders,
  k: number,
  last: number,
  dir: 1 | -1,
  count: number,
  low: number,
  high: number,
): { cell: CellNote[]; entryIdx: number } | null {
  const cdef = def.source === 'triads' ? def.cells[k % def.cells.length] : null;
  const lad = cdef ? ladders[cdef.triad] : null;
  for (let d = 1; d <= 127; d++) {
    for (const m of [last + dir * d, last - dir * d]) {
      if (m < 0 || m > 127) continue;
      const e = lad ? lad.indexOf[m] : ladders.hexIndexOf[m];
      if (e < 0) continue;
      const cell =
        cdef && lad
          ? triadNotes(cdef, lad, e, dir, count, low, high)
          : scaleNotes(def as Extract<PatternDef, { source: 'scale' }>, ladders, e, dir, count, low, high);
      if (cell) return { cell, entryIdx: e };
    }
  }
  return null;
}

/**
 * Generates a drill over a progression (spec.changes, spec.choruses times): the line runs on
 * through every chord in that chord's pair, each chord starting a new cell that enters above
 * (or below) the last note, and turns around at the range's edges instead of stopping. It lasts
 * exactly the progression's beats times the choruses. Called by generateDrill.
 *
 * @example
 * generateChangesDrill({ pattern: 'weave', direction: 'up',
 *   changes: [{ chord: 'Dm7', beats: 4 }, { chord: 'G7', beats: 4 }, { chord: 'Cmaj7', beats: 8 }] })
 *   .changes?.map((c) => c.startBeat) // [0, 4, 8]
 */
export function generateChangesDrill(spec: DrillSpec): Drill {
  const def = resolvePattern(spec.pattern);
  checkDirection(spec.direction);
  const meter = resolveMeter(spec.meter);
  checkMeterFits(def.name, def.subdivision, meter);
  const duration = noteLength(def.subdivision, meter);
  // notes per quarter (3 for triplets): dividing by it keeps beats such as 10/3 exact
  const perBeat = tidy(1 / duration);
  const { list, times } = checkChanges(spec.changes, spec.choruses, perBeat);
  const instrument = resolveInstrument(spec.instrument);
  const inst = instruments[instrument];
  const range = resolveRange(spec.range, inst.drillRange);
  const beatsPerChorus = list.reduce((s, c) => s + c.beats, 0);
  const totalSlots = Math.round(beatsPerChorus * times * perBeat);
  if (totalSlots > MAX_NOTES) {
    throw new EngineError(`That is ${totalSlots} notes: play fewer choruses or a shorter progression.`);
  }
  const firstPair = list[0].pair ?? candidatePairs(list[0].chord)[0];
  const filled: FilledDrillSpec = {
    pair: [firstPair[0], firstPair[1]],
    pattern: spec.pattern,
    direction: spec.direction,
    range,
    start: 0,
    instrument,
    tempo: resolveTempo(spec.tempo),
    meter,
    changes: list,
    choruses: times,
  };
  if (spec.chord !== undefined) filled.chord = spec.chord;
  const descending = spec.direction === 'down';
  const firstLadders = laddersFor(pairOf(firstPair[0], firstPair[1]), inst.transposition);
  const start =
    spec.start === undefined
      ? defaultStart(def, firstLadders, filled, descending)
      : snapStart(spec.start, startLadder(def, firstLadders), descending);
  filled.start = start;

  const notes: DrillNote[] = [];
  const changes: DrillChange[] = [];
  const st: LineState = {
    dir: descending ? -1 : 1,
    last: start,
    prevEntry: { a: -1, b: -1 },
    lastEntryMidi: start,
    lastEntryPos: 0,
    base: -1,
  };
  let k = 0; // cell counter, on through the whole progression
  let slot = 0;
  let played = false;
  const { low, high } = range;
  // notes per measure: checkMeterFits has made it a whole number
  const perMeasure = Math.round(measureLength(meter) / duration);
  const unitsPerNote = (duration * meter[1]) / 4;

  for (let chorus = 0; chorus < times; chorus++) {
    for (const change of list) {
      const startBeat = tidy(slot / perBeat);
      const end = slot + Math.round(change.beats * perBeat);
      const pair = change.pair ?? (played ? choosePair(change.chord, st.last) : firstPair);
      const chordIndex = changes.length;
      changes.push({ chord: change.chord, pair: [pair[0], pair[1]], startBeat, beats: change.beats });
      const ladders = laddersFor(pairOf(pair[0], pair[1]), inst.transposition);
      st.prevEntry = { a: -1, b: -1 };
      let fresh = played; // the first cell of a chord enters above / below the last note
      while (slot < end) {
        const count = def.source === 'scale' ? def.degrees.length : def.cells[k % def.cells.length].notes;
        const n = Math.min(count, end - slot);
        let cell: CellNote[] | null = null;
        let entryIdx = -1;
        for (const dir of [st.dir, -st.dir as 1 | -1]) {
          if (def.source === 'scale') {
            let base: number;
            if (!played) base = ladders.hexIndexOf[start];
            else if (fresh) base = hexBeyond(ladders, st.last, dir);
            else base = st.base + dir * def.step;
            cell = scaleNotes(def, ladders, base, dir, n, low, high);
            entryIdx = base;
          } else {
            const cdef = def.cells[k % def.cells.length];
            const lad = ladders[cdef.triad];
            entryIdx = played ? triadEntry(cdef, lad, st, dir, fresh) : lad.indexOf[start];
            cell = triadNotes(cdef, lad, entryIdx, dir, n, low, high);
          }
          if (cell) {
            st.dir = dir;
            break;
          }
        }
        if (!cell && played) {
          // At an edge the mirrored cell may not fit either (weave's b cell enters above the last
          // note): turn with the cell entering on the tone nearest the last note from which it fits.
          const dir = -st.dir as 1 | -1;
          const turned = nearestFit(def, ladders, k, st.last, dir, n, low, high);
          if (turned) {
            ({ cell, entryIdx } = turned);
            st.dir = dir;
          }
        }
        if (!cell) {
          throw new EngineError(
            `The range ${low}-${high} is too narrow for this pattern over ${change.chord}: widen it.`,
          );
        }
        if (def.source === 'scale') st.base = entryIdx;
        else {
          const triad = cell[0].triad;
          const lad = cell[0].lad;
          st.prevEntry[triad] = entryIdx;
          st.lastEntryMidi = lad.midi[entryIdx];
          st.lastEntryPos = lad.pos[entryIdx];
        }
        for (const c of cell) {
          const beat = slot / perBeat;
          const inMeasure = slot % perMeasure;
          const measure = (slot - inMeasure) / perMeasure + 1;
          const beatInMeasure = tidy(inMeasure * unitsPerNote + 1);
          notes.push({
            midi: c.lad.midi[c.idx],
            name: c.lad.name[c.idx],
            written: c.lad.written[c.idx],
            beat,
            duration,
            measure,
            beatInMeasure,
            source: def.source === 'scale' ? 'scale' : c.triad,
            cell: k,
            chordIndex,
          });
          slot++;
        }
        st.last = notes[notes.length - 1].midi;
        played = true;
        fresh = false;
        k++;
      }
    }
  }
  return { spec: filled, notes, measures: measuresFor(totalSlots / perBeat, meter), changes };
}

/**
 * A chord symbol moved by some semitones, its root (and bass) respelled from C Db D Eb E F F# G
 * Ab A Bb B, the rest of the symbol kept.
 *
 * @example
 * moveChordSymbol('Dm7', 5) // 'Gm7'
 */
export function moveChordSymbol(chord: string, semitones: number): string {
  const key = `${chord}|${semitones}`;
  const hit = movedCache.get(key);
  if (hit !== undefined) return hit;
  const [tonic, type, bass] = Chord.tokenize(chord);
  let moved = chord;
  if (tonic) {
    moved = rootSpelling(chromaOf(tonic) + semitones) + type;
    if (bass) moved += `/${rootSpelling(chromaOf(bass) + semitones)}`;
  }
  if (movedCache.size > 4096) movedCache.clear();
  movedCache.set(key, moved);
  return moved;
}

const movedCache = new Map<string, string>();

/**
 * A progression moved to another key: every chord, and every pinned pair (spelled as a unit).
 *
 * @example
 * moveChanges([{ chord: 'D7', beats: 4, pair: ['D', 'C'] }], 2)
 * // [{ chord: 'E7', beats: 4, pair: ['E', 'D'] }]
 */
export function moveChanges(changes: ChordChange[], semitones: number): ChordChange[] {
  return changes.map((c) => {
    const out: ChordChange = { chord: moveChordSymbol(c.chord, semitones), beats: c.beats };
    if (c.pair) out.pair = movePair([c.pair[0], c.pair[1]], semitoneInterval(semitones));
    return out;
  });
}
