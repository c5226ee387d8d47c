import {
  createLiveScorer,
  type Drill,
  type DrillNote,
  expectedTimeMs,
  type LiveScorer,
  type NoteResult,
  type PlayedNote,
  type ScoreOptions,
  type ScoreUpdate,
  scoreTake,
  scoringWindows,
  type TakeScore,
} from '@shared/engine';
import type { NoteEvent } from '@/lib/midi-input';

/**
 * One take on the performance.now() clock: the first downbeat is `origin`; every note's time is
 * its own event timestamp minus the origin and the input device's measured latency. The live
 * scorer gets each note at once and a tick every animation frame; the page only draws.
 */
export interface TakeSnapshot {
  phase: 'count-in' | 'playing' | 'done';
  /** index -> the newest result for that expected note */
  results: Map<number, { result: NoteResult; settled: boolean }>;
  /** the expected note due now (for the staff and the keyboard) */
  current: number | null;
  played: number;
}

export interface FinishedTake {
  played: PlayedNote[];
  score: TakeScore;
  /** the expected notes scored (fewer when stopped early) */
  expected: DrillNote[];
  stoppedAtMs: number | null;
}

/** How late an input event may reach the page after its own timestamp. */
const DELIVERY_MARGIN_MS = 50;

export class TakeSession {
  readonly origin: number;
  readonly played: PlayedNote[] = [];
  private scorer: LiveScorer;
  private results = new Map<number, { result: NoteResult; settled: boolean }>();
  private open = new Map<number, number>();
  private times: number[];
  private endMs: number;
  private hitMs: number;
  private current: number | null = null;
  private finished: FinishedTake | null = null;

  constructor(
    readonly drill: Drill,
    readonly options: ScoreOptions,
    countInMs: number,
    private latencyMs: number,
    now = performance.now(),
  ) {
    this.origin = now + countInMs;
    this.scorer = createLiveScorer(drill.notes, options);
    const swing = options.swing ?? 0.5;
    this.times = drill.notes.map((n) => expectedTimeMs(n.beat, options.tempo, swing));
    const windows = scoringWindows(drill.notes, options);
    this.hitMs = windows.hitWindowMs;
    const last = drill.notes.at(-1);
    const lastEnd = last ? this.times[this.times.length - 1] + (last.duration * 60000) / options.tempo : 0;
    this.endMs = Math.max(lastEnd, (this.times.at(-1) ?? 0) + windows.matchWindowMs) + 250;
  }

  /** Where the take's clock is now (ms from the first downbeat; negative in the count-in). */
  clock(now = performance.now()) {
    return now - this.origin;
  }

  get lengthMs() {
    return this.endMs;
  }

  /** A note from any input. Returns the updates it caused (provisional mark first). */
  note(e: NoteEvent): ScoreUpdate[] {
    if (this.finished) return [];
    const timeMs = e.timeStamp - this.origin - this.latencyMs;
    if (e.type === 'off') {
      const i = this.open.get(e.midi);
      if (i !== undefined) {
        this.played[i].durationMs = Math.max(0, timeMs - this.played[i].timeMs);
        this.open.delete(e.midi);
      }
      return [];
    }
    // A note before the count-in began is not part of the take.
    if (timeMs < -60000) return [];
    const note: PlayedNote = { midi: e.midi, timeMs: Math.round(timeMs * 100) / 100, velocity: e.velocity };
    this.open.set(e.midi, this.played.length);
    this.played.push(note);
    return this.apply(this.scorer.push(note));
  }

  /** Call every animation frame: settles what time has decided, moves the current note. */
  frame(now = performance.now()): { updates: ScoreUpdate[]; currentChanged: boolean; over: boolean } {
    const t = this.clock(now);
    // tick() promises that no earlier note will follow. A MIDI event reaches the page a little
    // after its own timestamp, and the device's latency moves it earlier still, so the scorer is
    // only told about time that no note still in flight can precede.
    const safe = t - this.latencyMs - DELIVERY_MARGIN_MS;
    const updates = this.finished || safe < 0 ? [] : this.apply(this.scorer.tick(safe));
    let current: number | null = null;
    if (t >= -this.hitMs) {
      // The first note not yet past its hit window is the one to play now.
      let lo = 0;
      let hi = this.times.length;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (this.times[mid] + this.hitMs < t) lo = mid + 1;
        else hi = mid;
      }
      current = lo < this.times.length ? lo : null;
    }
    const currentChanged = current !== this.current;
    this.current = current;
    return { updates, currentChanged, over: t > this.endMs };
  }

  snapshot(now = performance.now()): TakeSnapshot {
    const t = this.clock(now);
    return {
      phase: this.finished ? 'done' : t < 0 ? 'count-in' : 'playing',
      results: this.results,
      current: this.current,
      played: this.played.length,
    };
  }

  /** Ends the take. Stopped early: the notes due after the stop are left out of the score. */
  finish(stoppedAtMs: number | null = null): FinishedTake {
    if (this.finished) return this.finished;
    let expected = this.drill.notes;
    let score: TakeScore;
    if (stoppedAtMs === null) {
      score = this.scorer.finish();
    } else {
      const msPerBeat = 60000 / this.options.tempo;
      expected = this.drill.notes.filter((n) => n.beat * msPerBeat <= stoppedAtMs);
      score = scoreTake(expected, this.played, this.options);
    }
    this.results = new Map(score.results.map((r, i) => [i, { result: r, settled: true }]));
    this.finished = { played: this.played, score, expected, stoppedAtMs };
    return this.finished;
  }

  private apply(updates: ScoreUpdate[]): ScoreUpdate[] {
    for (const u of updates) this.results.set(u.index, { result: u.result, settled: u.settled });
    return updates;
  }
}

/** The staff class for a note's mark; provisional marks are drawn lighter. */
export function markClass(entry: { result: NoteResult; settled: boolean }): string {
  return `sf-mark-${entry.result.verdict}${entry.settled ? '' : ' sf-provisional'}`;
}
