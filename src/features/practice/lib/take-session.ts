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
  type Verdict,
} from '@shared/engine';
import type { InputKind } from '@shared/schemas/takes';
import type { NoteEvent } from '@/lib/midi-input';

/**
 * One take on the performance.now() clock: the first downbeat is `origin`; every note's time is
 * its own event timestamp minus the origin and the input device's measured latency. The live
 * scorer gets each note at once and a tick every animation frame, only up to time that no note
 * still on its way can precede; the page only draws.
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
  /** the drill (or passage of it) the take played, and how it was scored */
  drill: Drill;
  options: ScoreOptions;
  played: PlayedNote[];
  score: TakeScore;
  /** the expected notes scored (fewer when stopped early) */
  expected: DrillNote[];
  stoppedAtMs: number | null;
  /** what most of the notes came from (null when nothing was played) */
  inputKind: InputKind | null;
}

const KIND_OF_SOURCE: Record<NoteEvent['source'], InputKind> = {
  midi: 'midi',
  mic: 'microphone',
  keys: 'keyboard',
  screen: 'keyboard',
};

/**
 * How late an input event may reach the page after its own timestamp before any lag has been
 * seen (a busy main thread delays delivery by a few ms); the largest lag seen is added to it.
 */
const DELIVERY_MARGIN_MS = 50;

/** A note's mark as the page shows it; `settled` once the scorer will not change it. */
export interface LiveMark {
  verdict: Verdict;
  settled: boolean;
}

export class TakeSession {
  readonly origin: number;
  /** the notes played, kept in time order (a late event is put in its place) */
  readonly played: PlayedNote[] = [];
  private scorer: LiveScorer;
  private results = new Map<number, { result: NoteResult; settled: boolean }>();
  private open = new Map<number, PlayedNote>();
  private times: number[];
  private endMs: number;
  private hitMs: number;
  private matchMs: number;
  private current: number | null = null;
  private finished: FinishedTake | null = null;
  /** the largest delivery lag seen so far: arrival time less the event's own timestamp */
  private lagMs = 0;
  /** the scorer has been told that no note earlier than this will follow */
  private promised = Number.NEGATIVE_INFINITY;
  /** missed marks not shown yet: their match window is still open on the safe clock */
  private held = new Set<number>();
  private shownMarks: ReadonlyMap<number, LiveMark> = new Map();
  /** notes played from each kind of input */
  private kinds = new Map<InputKind, number>();

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
    this.matchMs = windows.matchWindowMs;
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

  /** The largest delivery lag seen in this take, in ms. */
  get deliveryLagMs() {
    return this.lagMs;
  }

  /**
   * Take time that no note still on its way can precede: the clock less the input's latency,
   * the largest delivery lag seen so far and a small margin.
   */
  safeClock(now = performance.now()) {
    return this.clock(now) - this.latencyMs - this.lagMs - DELIVERY_MARGIN_MS;
  }

  /** The marks to show (a note not in the map is unmarked). */
  marks(): ReadonlyMap<number, LiveMark> {
    return this.shownMarks;
  }

  /**
   * A note from any input, `now` being when it reached the page. Returns whether the marks
   * changed. A note older than what the scorer was already promised (it reached the page later
   * than any before it) rescores the take so far, correcting the marks it changes.
   */
  note(e: NoteEvent, now = performance.now()): boolean {
    if (this.finished) return false;
    this.lagMs = Math.max(this.lagMs, now - e.timeStamp);
    const timeMs = e.timeStamp - this.origin - this.latencyMs;
    if (e.type === 'off') {
      const on = this.open.get(e.midi);
      if (on) {
        on.durationMs = Math.max(0, timeMs - on.timeMs);
        this.open.delete(e.midi);
      }
      return false;
    }
    // A note before the count-in began is not part of the take.
    if (timeMs < -60000) return false;
    const kind = KIND_OF_SOURCE[e.source];
    this.kinds.set(kind, (this.kinds.get(kind) ?? 0) + 1);
    const note: PlayedNote = { midi: e.midi, timeMs: Math.round(timeMs * 100) / 100, velocity: e.velocity };
    this.open.set(e.midi, note);
    let at = this.played.length;
    while (at > 0 && this.played[at - 1].timeMs > note.timeMs) at--;
    this.played.splice(at, 0, note);
    if (note.timeMs < this.promised) {
      this.rescore(now);
      return true;
    }
    this.promised = note.timeMs;
    this.apply(this.scorer.push(note));
    return this.refresh(now);
  }

  /** Call every animation frame: settles what time has decided, moves the current note. */
  frame(now = performance.now()): { changed: boolean; currentChanged: boolean; over: boolean } {
    const t = this.clock(now);
    const safe = this.safeClock(now);
    let changed = false;
    if (!this.finished && safe > this.promised && safe >= 0) {
      this.promised = safe;
      const updates = this.scorer.tick(safe);
      this.apply(updates);
      changed = this.refresh(now, updates.length > 0);
    } else if (!this.finished) changed = this.refresh(now, false);
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
    return { changed, currentChanged, over: t > this.endMs };
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
    this.held.clear();
    this.shownMarks = new Map(score.results.map((r, i) => [i, { verdict: r.verdict, settled: true }]));
    const inputKind = [...this.kinds].sort((a, b) => b[1] - a[1])[0]?.[0] ?? null;
    this.finished = {
      drill: this.drill,
      options: this.options,
      played: this.played,
      score,
      expected,
      stoppedAtMs,
      inputKind,
    };
    return this.finished;
  }

  /** A fresh scorer fed every note so far in time order, then told the safe time. */
  private rescore(now: number) {
    this.scorer = createLiveScorer(this.drill.notes, this.options);
    this.results = new Map();
    for (const p of this.played) this.apply(this.scorer.push(p));
    this.promised = this.played.at(-1)?.timeMs ?? Number.NEGATIVE_INFINITY;
    const safe = this.safeClock(now);
    if (safe > this.promised && safe >= 0) {
      this.promised = safe;
      this.apply(this.scorer.tick(safe));
    }
    this.refresh(now);
  }

  private apply(updates: ScoreUpdate[]) {
    for (const u of updates) this.results.set(u.index, { result: u.result, settled: u.settled });
  }

  /**
   * Rebuilds the shown marks when the results changed, or when a held-back miss may now show.
   * A note is shown missed only once its match window has closed on the safe clock: until
   * then a played note could still be matched to it.
   */
  private refresh(now: number, resultsChanged = true): boolean {
    const safe = this.safeClock(now);
    if (!resultsChanged) {
      let due = false;
      for (const i of this.held) if (this.times[i] + this.matchMs < safe) due = true;
      if (!due) return false;
    }
    const next = new Map<number, LiveMark>();
    this.held.clear();
    for (const [i, { result, settled }] of this.results) {
      if (result.verdict === 'missed' && !settled && this.times[i] + this.matchMs >= safe) {
        this.held.add(i);
        continue;
      }
      next.set(i, { verdict: result.verdict, settled });
    }
    this.shownMarks = next;
    return true;
  }
}
