import { chordKey, drillKey, patternName } from '../../../shared/practice/drill-identity';
import { quarterTempo } from '../../../shared/engine';
import { generateChecked } from '../../../shared/engine/patterns/checked';
import type { DrillSpec as SpecInput } from '../../../shared/schemas/drills';
import { AppError } from '../../errors';
import {
  type Drill,
  type DrillNote,
  type DrillSpec,
  type PlayedNote,
  type ScoreOptions,
  scoreTake,
  sliceDrill,
  type TakeScore,
} from '../../../shared/engine';

/** The windows a client may ask for; anything wider would let sloppy playing count as clean. */
export const WINDOW_BOUNDS = { hitMin: 20, hitMax: 150, matchMax: 400 } as const;

export interface ScoredTake {
  drill: Drill;
  /** the expected notes that were scored (after a ladder slice and a stop point) */
  expected: DrillNote[];
  options: ScoreOptions;
  score: TakeScore;
  key: string;
  pattern: string;
  pair: string;
  /** over a progression, each expected note's chord's key and pair (the key map counts every chord) */
  noteKeys: { key: string; pair: string }[] | null;
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

/** Keeps the client's options inside the bounds and the tempo at the drill's own. */
export function boundOptions(options: ScoreOptions, tempo: number): ScoreOptions {
  const bounded: ScoreOptions = { ...options, tempo };
  if (bounded.hitWindowMs !== undefined)
    bounded.hitWindowMs = clamp(bounded.hitWindowMs, WINDOW_BOUNDS.hitMin, WINDOW_BOUNDS.hitMax);
  if (bounded.matchWindowMs !== undefined) {
    const floor = bounded.hitWindowMs ?? WINDOW_BOUNDS.hitMin;
    bounded.matchWindowMs = clamp(bounded.matchWindowMs, floor, WINDOW_BOUNDS.matchMax);
  }
  return bounded;
}

/**
 * Scores raw notes with the same engine the browser uses: the server never trusts a score
 * sent to it. A ladder step is scored on its slice; a take stopped early leaves out the
 * notes that were due after the stop.
 */
export function scoreRawTake(input: {
  spec: DrillSpec;
  played: PlayedNote[];
  options: ScoreOptions;
  measures?: [number, number] | null;
  stoppedAtMs?: number | null;
}): ScoredTake {
  const checked = generateChecked(input.spec as SpecInput);
  if (!checked.ok) {
    const fields = Object.fromEntries(Object.entries(checked.fields).map(([k, v]) => [`spec.${k}`, v]));
    throw new AppError('validation', checked.message, fields);
  }
  let drill = checked.drill;
  if (input.measures) drill = sliceDrill(drill, input.measures[0], input.measures[1]);
  // The scorer counts quarter notes; a compound meter's tempo counts dotted quarters.
  const options = boundOptions(input.options, quarterTempo(drill.spec.tempo, drill.spec.meter));
  const msPerBeat = 60000 / options.tempo;
  const stop = input.stoppedAtMs;
  const expected =
    stop === undefined || stop === null ? drill.notes : drill.notes.filter((n) => n.beat * msPerBeat <= stop);
  const score = scoreTake(expected, input.played, options);
  return {
    drill,
    expected,
    options,
    score,
    key: drillKey(drill.spec),
    pattern: patternName(drill.spec),
    pair: `${drill.spec.pair[0]}/${drill.spec.pair[1]}`,
    noteKeys: drill.changes ? chordKeysOf(drill, expected) : null,
  };
}

/** Each note's chord: its root as the key, its pair as the pair. */
function chordKeysOf(drill: Drill, notes: DrillNote[]): { key: string; pair: string }[] {
  const byChord = (drill.changes ?? []).map((c) => ({ key: chordKey(c.chord), pair: `${c.pair[0]}/${c.pair[1]}` }));
  const first = byChord[0];
  return notes.map((n) => byChord[n.chordIndex ?? 0] ?? first);
}
