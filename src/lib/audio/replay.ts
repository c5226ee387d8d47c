import { type Drill, type PlayedNote, quarterTempo } from '@shared/engine';
import { Midi } from 'tonal';

/** One sound of a replay, in seconds from the drill's first downbeat; gain 0..1. */
export interface ReplayNote {
  time: number;
  duration: number;
  midi: number;
  gain: number;
}

export interface ReplaySchedule {
  /** the drill as written (sounding pitch), played softly as a guide */
  written: ReplayNote[];
  /** what the player played, on top */
  played: ReplayNote[];
  /** when the replay is over: the later of the drill's last note and the last note played, plus a tail */
  end: number;
}

/** A guide note sounds for most of its written length, so repeated notes stay apart. */
const GUIDE_LENGTH = 0.8;
const GUIDE_GAIN = 0.5;
/** A played note without a recorded length (a note-off never came) sounds this long, in ms. */
const DEFAULT_PLAYED_MS = 150;
const SHORTEST_PLAYED = 0.08;
/** MIDI 1.0 velocity for a played note that carries none (a mid-loud touch). */
const DEFAULT_VELOCITY = 90;
/** Seconds of silence after the last sound before the replay counts as over. */
const TAIL = 1;

/**
 * What a replay plays, pure so tests read it without audio hardware: each written note at
 * beat x seconds per quarter (the tempo counts the meter's beat: a dotted quarter in 6/8), and
 * each played note at its own time from the downbeat (early notes before the downbeat at 0),
 * with its velocity as gain.
 *
 * @example
 * scheduleReplay(drill, [{ midi: 60, timeMs: 500 }]).played[0].time // 0.5
 */
export function scheduleReplay(drill: Drill, played: PlayedNote[]): ReplaySchedule {
  const spq = 60 / quarterTempo(drill.spec.tempo, drill.spec.meter);
  const written = drill.notes.map((n) => ({
    time: n.beat * spq,
    duration: n.duration * spq * GUIDE_LENGTH,
    midi: n.midi,
    gain: GUIDE_GAIN,
  }));
  const heard = played.map((p) => ({
    time: Math.max(0, p.timeMs) / 1000,
    duration: Math.max(SHORTEST_PLAYED, (p.durationMs ?? DEFAULT_PLAYED_MS) / 1000),
    midi: p.midi,
    gain: (p.velocity ?? DEFAULT_VELOCITY) / 127,
  }));
  const drillEnd = Math.max(0, ...drill.notes.map((n) => (n.beat + n.duration) * spq));
  const playedEnd = Math.max(0, ...heard.map((n) => n.time + n.duration));
  return { written, played: heard, end: Math.max(drillEnd, playedEnd) + TAIL };
}

export interface Replay {
  /** stops the replay (also while Tone.js is still loading); safe to call more than once */
  stop(): void;
  /** settles once the sounds are scheduled; rejects when the browser gives no sound */
  ready: Promise<void>;
}

/** Seconds between asking and the first sound, so the first notes are not cut. */
const LEAD_IN = 0.2;

let current: Replay | null = null;

/**
 * Plays a take back: the drill as written, soft, and what was played on top, from the first
 * downbeat. One replay at a time on every page: starting one stops the one before, even one
 * still loading. `onEnd` is called once, when it ends or is stopped.
 */
export function replayTake(drill: Drill, played: PlayedNote[], opts: { onEnd?: () => void } = {}): Replay {
  current?.stop();
  const schedule = scheduleReplay(drill, played);
  let stopped = false;
  let silence: (() => void) | null = null;
  const replay: Replay = {
    stop() {
      if (stopped) return;
      stopped = true;
      if (current === replay) current = null;
      silence?.();
      opts.onEnd?.();
    },
    ready: Promise.resolve(),
  };
  current = replay;
  replay.ready = (async () => {
    const Tone = await import('tone');
    await Tone.start();
    if (stopped) return;
    const guide = new Tone.PolySynth(Tone.Synth, { oscillator: { type: 'sine' } }).toDestination();
    guide.volume.value = -22;
    const lead = new Tone.PolySynth(Tone.Synth, { oscillator: { type: 'triangle' } }).toDestination();
    lead.volume.value = -8;
    const t0 = Tone.now() + LEAD_IN;
    const hz = Midi.midiToFreq;
    for (const n of schedule.written) guide.triggerAttackRelease(hz(n.midi), n.duration, t0 + n.time, n.gain);
    for (const n of schedule.played) lead.triggerAttackRelease(hz(n.midi), n.duration, t0 + n.time, n.gain);
    const timer = setTimeout(() => replay.stop(), (LEAD_IN + schedule.end) * 1000);
    silence = () => {
      clearTimeout(timer);
      // Notes scheduled later would still start before disposal: mute first, then let go.
      for (const synth of [guide, lead]) {
        synth.releaseAll();
        synth.volume.value = Number.NEGATIVE_INFINITY;
      }
      setTimeout(() => {
        guide.dispose();
        lead.dispose();
      }, 300);
    };
  })();
  replay.ready.catch(() => replay.stop());
  return replay;
}

/** Stops whichever replay is playing, on any page. */
export function stopReplay(): void {
  current?.stop();
}
