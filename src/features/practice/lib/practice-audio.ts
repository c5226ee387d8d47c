import { type Drill, quarterTempo } from '@shared/engine';
import { Midi } from 'tonal';
import type * as ToneNs from 'tone';
import { scheduleDrill } from '@/lib/audio/schedule';

type Tone = typeof ToneNs;
let tonePromise: Promise<Tone> | null = null;
const loadTone = () => {
  tonePromise ??= import('tone').then((Tone) => {
    // Played notes must sound at once: no look-ahead for this page's context.
    Tone.getContext().lookAhead = 0;
    return Tone;
  });
  return tonePromise;
};

const hz = Midi.midiToFreq;

export type ClickMode = 'every-beat' | 'two-and-four' | 'off';

/** The audio clock time that sounds at a given performance.now() time. */
function audioTimeFor(Tone: Tone, perfTime: number): number {
  const raw = Tone.getContext().rawContext as AudioContext;
  const stamp = typeof raw.getOutputTimestamp === 'function' ? raw.getOutputTimestamp() : null;
  if (stamp?.contextTime !== undefined && stamp.performanceTime !== undefined && stamp.performanceTime > 0) {
    return stamp.contextTime + (perfTime - stamp.performanceTime) / 1000;
  }
  return raw.currentTime + (perfTime - performance.now()) / 1000;
}

/**
 * The click, count-in and chord pad under a take, lined up so the first downbeat sounds at
 * `originPerf` on the performance.now() clock (the take's own clock). Never plays the drill.
 */
export async function startBacking(
  drill: Drill,
  opts: { originPerf: number; countInMeasures: number; click: ClickMode; pad: boolean; volumeDb: number },
): Promise<{ stop(): void }> {
  const Tone = await loadTone();
  await Tone.start();
  const { events, downbeat } = scheduleDrill(drill, {
    click: opts.click !== 'off',
    pad: opts.pad,
    countInMeasures: opts.countInMeasures,
  });
  const clickSynth = new Tone.Synth({
    oscillator: { type: 'square' },
    envelope: { attack: 0.001, decay: 0.02, sustain: 0, release: 0.01 },
  }).toDestination();
  clickSynth.volume.value = opts.volumeDb - 12;
  const pad = new Tone.PolySynth(Tone.Synth, {
    oscillator: { type: 'sine' },
    envelope: { attack: 0.1, decay: 0.3, sustain: 0.6, release: 0.4 },
  }).toDestination();
  pad.volume.value = opts.volumeDb - 20;
  const zero = audioTimeFor(Tone, opts.originPerf) - downbeat;
  const [beats] = drill.spec.meter;
  const beatUnit = 4 / drill.spec.meter[1];
  const secPerUnit = (60 / quarterTempo(drill.spec.tempo, drill.spec.meter)) * beatUnit;
  // The last moment anything scheduled still sounds: nothing may be torn down before it.
  let lastAt = Tone.now();
  for (const e of events) {
    const at = zero + e.time;
    if (at < Tone.now()) continue;
    if (e.kind === 'click') {
      if (opts.click === 'two-and-four' && !e.countIn) {
        const beatInBar = Math.round((e.time - downbeat) / secPerUnit) % beats;
        if (beatInBar !== 1 && beatInBar !== 3) continue;
      }
      clickSynth.triggerAttackRelease(e.accent ? 1760 : 1320, 0.02, at, e.accent ? 1 : 0.6);
      lastAt = Math.max(lastAt, at + 0.05);
    } else if (e.kind === 'pad') {
      pad.triggerAttackRelease(e.midis.map(hz), e.duration, at, 0.5);
      lastAt = Math.max(lastAt, at + e.duration + 0.5);
    }
  }
  return {
    stop() {
      const now = Tone.now();
      // Silent at once; torn down only once everything scheduled has passed. Disposing a synth
      // with notes still scheduled leaves the audio graph to disconnect nodes that are gone
      // (the browser throws InvalidAccessError).
      clickSynth.volume.value = Number.NEGATIVE_INFINITY;
      pad.volume.value = Number.NEGATIVE_INFINITY;
      clickSynth.triggerRelease(now);
      pad.releaseAll(now);
      setTimeout(
        () => {
          clickSynth.dispose();
          pad.dispose();
        },
        Math.max(0.6, lastAt - now + 1) * 1000,
      );
    },
  };
}

/** Clicks at given performance.now() times, for the latency calibration. */
export async function playClicks(perfTimes: number[], volumeDb: number): Promise<void> {
  const Tone = await loadTone();
  await Tone.start();
  const synth = new Tone.Synth({
    oscillator: { type: 'square' },
    envelope: { attack: 0.001, decay: 0.03, sustain: 0, release: 0.01 },
  }).toDestination();
  synth.volume.value = volumeDb - 10;
  for (const t of perfTimes) synth.triggerAttackRelease(1500, 0.03, audioTimeFor(Tone, t));
  setTimeout(() => synth.dispose(), Math.max(0, perfTimes.at(-1)! - performance.now()) + 1000);
}

/**
 * "Hear yourself": the played notes through a small synth (many wind controllers make no sound
 * of their own). Breath (CC 2) sets the level while a note sounds.
 */
export class PlayedSynth {
  private synth: ToneNs.PolySynth | null = null;
  private loading: Promise<void> | null = null;
  private volumeDb = -10;
  private muted = false;
  private breathGain = 1;

  async ensure() {
    this.loading ??= loadTone().then(async (Tone) => {
      await Tone.start();
      this.synth = new Tone.PolySynth(Tone.Synth, {
        oscillator: { type: 'triangle' },
        envelope: { attack: 0.003, decay: 0.1, sustain: 0.5, release: 0.08 },
      }).toDestination();
      this.apply();
    });
    return this.loading;
  }

  setVolume(db: number) {
    this.volumeDb = db;
    this.apply();
  }

  setMuted(muted: boolean) {
    this.muted = muted;
    this.apply();
  }

  breath(value: number) {
    this.breathGain = Math.max(0.05, value / 127);
    this.apply();
  }

  noteOn(midi: number, velocity: number) {
    if (!this.synth || this.muted) return;
    this.synth.triggerAttack(hz(midi), undefined, velocity / 127);
  }

  noteOff(midi: number) {
    this.synth?.triggerRelease(hz(midi));
  }

  private apply() {
    if (!this.synth) return;
    this.synth.volume.value = this.muted ? -Infinity : this.volumeDb + 20 * Math.log10(this.breathGain);
  }
}
