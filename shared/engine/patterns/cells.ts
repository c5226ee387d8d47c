import type { DrillNote, MidiRange, PatternDef, TriadCellDef } from '../types';
import type { Ladder } from './ladder';

/** A generated note before it is placed in time (its time fields are filled in later). */
export type RawNote = DrillNote;

function rawNote(midi: number, name: string, written: string, source: RawNote['source'], cell: number): RawNote {
  return { midi, name, written, beat: 0, duration: 0, measure: 0, beatInMeasure: 0, source, cell };
}

export interface Ladders {
  a: Ladder;
  b: Ladder;
  /** the six-note scale over the MIDI compass: which triad and ladder index each tone is */
  hex: { triad: 'a' | 'b'; idx: number; midi: number }[];
  hexIndexOf: Int16Array;
}

/** Safety net for custom patterns that wander without ever leaving the range. */
const MAX_NOTES = 4096;

const LEAP = [0, 2, 1, 0];

/** Where one run of cells begins and how far it may go. */
export interface Run {
  start: number;
  range: MidiRange;
  descending: boolean;
  /** stop after this many cells (used to test a start) */
  maxCells?: number;
}

function pushNote(out: RawNote[], lad: Ladder, idx: number, source: RawNote['source'], cell: number): void {
  out.push(rawNote(lad.midi[idx], lad.name[idx], lad.written[idx], source, cell));
}

/**
 * Runs a triad pattern from `start` (a tone of the first cell's triad) and returns the notes
 * of every complete cell that fits, numbering cells from 0.
 */
export function runTriadCells(cells: TriadCellDef[], ladders: Ladders, run: Run): RawNote[] {
  const { range, descending } = run;
  const dir = descending ? -1 : 1;
  const out: RawNote[] = [];
  const prevEntry = { a: -1, b: -1 };
  let last = -1;
  let lastEntryMidi = -1;
  let lastEntryPos = 0;
  const seenCycles = new Set<string>();
  const seenStates = new Set<string>();
  let cycleStart = 0;
  for (let k = 0; ; k++) {
    if (run.maxCells !== undefined && k >= run.maxCells) break;
    const ci = k % cells.length;
    if (ci === 0 && k > 0) {
      // A cycle that repeats notes already played, or a state already met, never moves on. Presets
      // are checked too: weave on a pair such as Cdim/E comes back to where it began.
      const cycle = out
        .slice(cycleStart)
        .map((n) => n.midi)
        .join(',');
      const state = `${last}|${prevEntry.a}|${prevEntry.b}|${lastEntryMidi}|${lastEntryPos}`;
      if (seenCycles.has(cycle)) {
        out.length = cycleStart;
        break;
      }
      if (seenStates.has(state)) break;
      seenCycles.add(cycle);
      seenStates.add(state);
      cycleStart = out.length;
    }
    if (out.length > MAX_NOTES) break;
    const def = cells[ci];
    const lad = ladders[def.triad];
    let e: number;
    if (k === 0) {
      e = lad.indexOf[run.start];
    } else {
      let entry = def.entry;
      if (entry === 'next-position' && prevEntry[def.triad] < 0) entry = 'above';
      switch (entry) {
        case 'start':
        case 'above':
          e = descending ? lad.below[last] : lad.above[last];
          break;
        case 'below':
          e = descending ? lad.above[last] : lad.below[last];
          break;
        case 'next-position':
          e = prevEntry[def.triad] + dir;
          break;
        default: {
          // same-position: the tone of the previous entry's position closest to that entry
          const up = lastEntryMidi + ((((lad.chroma[lastEntryPos] - lastEntryMidi) % 12) + 12) % 12);
          const down = up - 12;
          const dUp = up - lastEntryMidi;
          const dDown = lastEntryMidi - down;
          const m = dUp < dDown || (dUp === dDown && !descending) ? up : down;
          e = m >= 0 && m < 128 ? lad.indexOf[m] : -1;
        }
      }
    }
    const motion = (def.motion === 'up' ? 1 : -1) * dir;
    const cellStart = out.length;
    let fits = e >= 0 && e < lad.midi.length;
    for (let i = 0; fits && i < def.notes; i++) {
      const idx = e + motion * (def.shape === 'line' ? i : LEAP[i]);
      // bounds first: reading past an array's end is slow in JS engines
      const m = idx >= 0 && idx < lad.midi.length ? lad.midi[idx] : -1;
      if (m < range.low || m > range.high) fits = false;
      else pushNote(out, lad, idx, def.triad, k);
    }
    if (!fits) {
      out.length = cellStart;
      break;
    }
    last = out[out.length - 1].midi;
    lastEntryMidi = lad.midi[e];
    lastEntryPos = lad.pos[e];
    prevEntry[def.triad] = e;
  }
  return out;
}

/** Runs a scale pattern: cell c plays degrees d + offsets for d = c x step, from the start. */
export function runScaleCells(def: Extract<PatternDef, { source: 'scale' }>, ladders: Ladders, run: Run): RawNote[] {
  const { range, descending } = run;
  const dir = descending ? -1 : 1;
  const out: RawNote[] = [];
  const s0 = ladders.hexIndexOf[run.start];
  if (s0 < 0) return out;
  for (let c = 0; out.length <= MAX_NOTES; c++) {
    if (run.maxCells !== undefined && c >= run.maxCells) break;
    if (c > 0 && def.step === 0) break; // would repeat the same cell without moving
    const cellStart = out.length;
    let fits = true;
    for (const off of def.degrees) {
      const at = s0 + dir * (c * def.step + off);
      const h = at >= 0 && at < ladders.hex.length ? ladders.hex[at] : null;
      if (!h || h.midi < range.low || h.midi > range.high) {
        fits = false;
        break;
      }
      const lad = ladders[h.triad];
      out.push(rawNote(h.midi, lad.name[h.idx], lad.written[h.idx], 'scale', c));
    }
    if (!fits) {
      out.length = cellStart;
      break;
    }
  }
  return out;
}

/** Runs any pattern. */
export function runCells(def: PatternDef, ladders: Ladders, run: Run): RawNote[] {
  return def.source === 'scale' ? runScaleCells(def, ladders, run) : runTriadCells(def.cells, ladders, run);
}
