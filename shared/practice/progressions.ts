import { candidatePairs, EngineError } from '../engine';
import { beatGroups, measureLength } from '../engine/patterns/timing';
import type { ChordChange, Meter } from '../engine/types';

/**
 * Progressions a player can start from, written as bar charts: bars between "|", two chords in
 * a bar share it. The changes are the trade's usual ones (common practice); the keys are ours.
 */
export const STARTING_PROGRESSIONS = [
  { id: 'ii-v-i-major', name: 'ii-V-I in major', chart: '| Dm7 | G7 | Cmaj7 | Cmaj7 |' },
  { id: 'ii-v-i-minor', name: 'ii-V-I in minor', chart: '| Dm7b5 | G7alt | Cm6 | Cm6 |' },
  {
    id: 'blues',
    name: '12-bar blues',
    chart: '| F7 | Bb7 | F7 | F7 | Bb7 | Bb7 | F7 | D7 | Gm7 | C7 | F7 | C7 |',
  },
  { id: 'turnaround', name: 'I-vi-ii-V turnaround', chart: '| Cmaj7 Am7 | Dm7 G7 |' },
  {
    id: 'minor-blues',
    name: 'Minor blues',
    chart: '| Cm7 | Cm7 | Cm7 | Cm7 | Fm7 | Fm7 | Cm7 | Cm7 | Ab7 | G7alt | Cm7 | G7alt |',
  },
] as const;

export type StartingProgressionId = (typeof STARTING_PROGRESSIONS)[number]['id'];

/** Longest chart the editor reads (a long tune's form, a few choruses in the spec itself). */
const MAX_BARS = 96;

/**
 * How a bar's beats are shared by n chords: by the meter's beat groups, the earlier chords
 * taking the extra group (two chords in 3/4: 2 + 1 beats), or null when more chords than beats.
 *
 * @example
 * splitBar(2, [4, 4]) // [2, 2]
 */
export function splitBar(n: number, meter: Meter): number[] | null {
  const groups = beatGroups(meter);
  if (n < 1 || n > groups.length) return null;
  const out: number[] = [];
  let g = 0;
  for (let i = 0; i < n; i++) {
    const take = Math.floor(groups.length / n) + (i < groups.length % n ? 1 : 0);
    let beats = 0;
    for (let j = 0; j < take; j++) beats += groups[g++];
    out.push(beats);
  }
  return out;
}

/**
 * Reads a bar chart ("| Dm7 G7 | Cmaj7 |") into chord changes: bars between "|" (without any
 * "|", each chord is a bar), chords in a bar share it, "%" repeats the bar before, and a chord
 * held over the bar line (the same symbol again) is one change. A symbol Sixfold cannot read
 * throws EngineError naming it and its bar. Pins of `previous` are kept for chords that stay.
 *
 * @example
 * parseChart('| Dm7 G7 | Cmaj7 | Cmaj7 |', [4, 4])
 * // [{ chord: 'Dm7', beats: 2 }, { chord: 'G7', beats: 2 }, { chord: 'Cmaj7', beats: 8 }]
 */
export function parseChart(text: string, meter: Meter, previous: ChordChange[] = []): ChordChange[] {
  const raw = text.includes('|') ? text.split('|') : text.trim().split(/\s+/);
  const bars = raw.map((b) => b.trim()).filter((b) => b !== '');
  if (bars.length === 0) throw new EngineError('Write at least one bar, such as | Dm7 G7 | Cmaj7 |.');
  if (bars.length > MAX_BARS) throw new EngineError(`A chart holds at most ${MAX_BARS} bars.`);
  const out: ChordChange[] = [];
  let last: string[] = [];
  const known = new Map<string, string | null>();
  bars.forEach((bar, i) => {
    const symbols = bar === '%' ? last : bar.split(/\s+/);
    if (symbols.length === 0) throw new EngineError(`Bar ${i + 1} repeats a bar, but there is none before it.`);
    for (const s of symbols) {
      if (!known.has(s)) {
        try {
          candidatePairs(s); // the fit finder's answer, kept for the drill that follows
          known.set(s, null);
        } catch (err) {
          if (!(err instanceof EngineError)) throw err;
          known.set(s, err.message);
        }
      }
      const problem = known.get(s);
      if (problem) throw new EngineError(`Bar ${i + 1}: ${problem}`);
    }
    const split = splitBar(symbols.length, meter);
    if (!split) {
      throw new EngineError(
        `Bar ${i + 1} holds ${symbols.length} chords; a bar of ${meter[0]}/${meter[1]} holds at most ${beatGroups(meter).length}.`,
      );
    }
    symbols.forEach((chord, k) => {
      const prev = out[out.length - 1];
      if (prev && prev.chord === chord) prev.beats += split[k];
      else out.push({ chord, beats: split[k] });
    });
    last = symbols;
  });
  // keep a pin where the chord at that place is the same chord
  return out.map((c, i) => {
    const before = previous[i];
    return before?.pair && before.chord === c.chord ? { ...c, pair: before.pair } : c;
  });
}

/**
 * Writes changes back as a bar chart: a chord over several bars is written in each bar.
 *
 * @example
 * chartOf([{ chord: 'Dm7', beats: 2 }, { chord: 'G7', beats: 2 }, { chord: 'Cmaj7', beats: 8 }], [4, 4])
 * // '| Dm7 G7 | Cmaj7 | Cmaj7 |'
 */
export function chartOf(changes: ChordChange[], meter: Meter): string {
  const len = measureLength(meter);
  const bars: string[][] = [];
  let at = 0;
  for (const c of changes) {
    const end = at + c.beats;
    for (let bar = Math.floor(at / len + 1e-9); bar * len < end - 1e-9; bar++) {
      bars[bar] ??= [];
      const inBar = bars[bar];
      if (inBar[inBar.length - 1] !== c.chord) inBar.push(c.chord);
    }
    at = end;
  }
  return `| ${bars.map((b) => (b ?? []).join(' ')).join(' | ')} |`;
}

/**
 * What a chart lasts: its beats in quarter notes.
 *
 * @example
 * progressionBeats([{ chord: 'Dm7', beats: 4 }, { chord: 'G7', beats: 4 }]) // 8
 */
export function progressionBeats(changes: ChordChange[]): number {
  return changes.reduce((s, c) => s + c.beats, 0);
}
