import { EngineError } from '../errors';
import type { DrillNote, NoteResult, PlayedNote, ScoreOptions, TakeScore, Verdict } from '../types';
import { type AlignData, MOVE_DIAG, MOVE_UP, pairCode, type Step } from './align';
import { checkOptions, expectedTimeMs, FREE_BAND, scoringWindows } from './windows';

/** Expected notes sorted by time (stable), with the data the alignment needs. */
export interface PreparedTake {
  data: AlignData;
  /** sorted expected position -> index into `expected` as passed */
  expOrder: number[];
  transposition: number;
}

/** Sorts the expected notes and fixes the windows; played notes are added by the caller. */
export function prepareExpected(expected: readonly DrillNote[], options: ScoreOptions): PreparedTake {
  checkOptions(options);
  const free = options.mode === 'free';
  for (const note of expected) {
    if (!Number.isFinite(note.beat) || !Number.isFinite(note.midi)) {
      throw new EngineError('Every drill note needs a beat and a pitch to be scored against.');
    }
  }
  const swing = options.swing ?? 0.5;
  // both modes rank the expected notes by time; free mode then scores by rank alone
  const times = expected.map((n) => (free ? n.beat : expectedTimeMs(n.beat, options.tempo, swing)));
  const expOrder = expected.map((_, k) => k);
  expOrder.sort((x, y) => times[x] - times[y] || x - y);
  const windows = free ? { hitWindowMs: 0, matchWindowMs: FREE_BAND } : scoringWindows(expected, options);
  const data: AlignData = {
    free,
    expTime: expOrder.map((k, pos) => (free ? pos : times[k])),
    expPitch: expOrder.map((k) => expected[k].midi),
    playTime: [],
    playPitch: [],
    hit: windows.hitWindowMs,
    win: windows.matchWindowMs,
    octave: options.octaveTolerant === true,
  };
  return { data, expOrder, transposition: options.inputTransposition ?? 0 };
}

/** Refuses a played note that carries no usable time or pitch. */
export function checkPlayed(note: PlayedNote): void {
  if (!Number.isFinite(note.timeMs) || !Number.isFinite(note.midi)) {
    throw new EngineError('A played note needs a time and a pitch.');
  }
}

const VERDICTS: Verdict[] = ['hit', 'early', 'late', 'wrong'];

/**
 * Turns one step of a traceback into what it decides: a result for an expected note (sorted
 * position `exp`) or an extra played note (`played`, an index into the notes as passed).
 */
export function stepOutcome(
  d: AlignData,
  step: Step,
  playOrder: readonly number[],
): { exp: number; result: NoteResult } | { exp: null; played: number } {
  const ei = step.i - 1;
  const pj = step.j - 1;
  if (step.move === MOVE_DIAG) {
    const code = pairCode(d, ei, pj);
    return {
      exp: ei,
      result: {
        verdict: VERDICTS[code],
        playedIndex: playOrder[pj],
        offsetMs: d.free ? null : d.playTime[pj] - d.expTime[ei],
      },
    };
  }
  if (step.move === MOVE_UP) return { exp: ei, result: { verdict: 'missed', playedIndex: null, offsetMs: null } };
  return { exp: null, played: playOrder[pj] };
}

/** Accuracy, mean offset and spread from per-note results. */
export function summarize(results: NoteResult[], extras: number[]): TakeScore {
  let hits = 0;
  const offsets: number[] = [];
  for (const r of results) {
    if (r.verdict === 'hit') hits++;
    if ((r.verdict === 'hit' || r.verdict === 'early' || r.verdict === 'late') && r.offsetMs !== null) {
      offsets.push(r.offsetMs);
    }
  }
  let meanOffsetMs: number | null = null;
  let spreadMs: number | null = null;
  if (offsets.length > 0) {
    const mean = offsets.reduce((s, x) => s + x, 0) / offsets.length;
    const variance = offsets.reduce((s, x) => s + (x - mean) * (x - mean), 0) / offsets.length;
    meanOffsetMs = mean;
    spreadMs = Math.sqrt(variance);
  }
  return {
    results,
    extras: [...extras].sort((x, y) => x - y),
    accuracy: results.length === 0 ? 0 : hits / results.length,
    meanOffsetMs,
    spreadMs,
  };
}
