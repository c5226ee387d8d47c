import type { Drill } from '@shared/engine';
import { Midi } from 'tonal';
import type * as ToneNs from 'tone';
import { type AudioEvent, type Schedule, type ScheduleOptions, scheduleDrill } from './schedule';
import { encodeWav } from './wav';

type Tone = typeof ToneNs;

let tonePromise: Promise<Tone> | null = null;
/** Tone.js is loaded only when a drill is first heard (its own chunk). */
const loadTone = () => {
  tonePromise ??= import('tone');
  return tonePromise;
};

const midiToHz = Midi.midiToFreq;

/** The three voices, made in whichever context is current (live or offline). */
function makeVoices(Tone: Tone) {
  const lead = new Tone.PolySynth(Tone.Synth, {
    oscillator: { type: 'triangle' },
    envelope: { attack: 0.004, decay: 0.08, sustain: 0.45, release: 0.03 },
  }).toDestination();
  lead.volume.value = -8;
  const click = new Tone.Synth({
    oscillator: { type: 'square' },
    envelope: { attack: 0.001, decay: 0.02, sustain: 0, release: 0.01 },
  }).toDestination();
  click.volume.value = -16;
  const pad = new Tone.PolySynth(Tone.Synth, {
    oscillator: { type: 'sine' },
    envelope: { attack: 0.08, decay: 0.3, sustain: 0.6, release: 0.3 },
  }).toDestination();
  pad.volume.value = -20;
  const play = (e: AudioEvent, time: number) => {
    if (e.kind === 'note') lead.triggerAttackRelease(midiToHz(e.midi), e.duration, time, e.velocity / 127);
    else if (e.kind === 'click') click.triggerAttackRelease(e.accent ? 1760 : 1320, 0.02, time, e.accent ? 1 : 0.6);
    else pad.triggerAttackRelease(e.midis.map(midiToHz), e.duration, time, 0.5);
  };
  const dispose = () => {
    for (const v of [lead, click, pad]) v.dispose();
  };
  return { play, dispose };
}

export interface Playback {
  stop(): void;
}

/**
 * Plays a drill through the speakers on Tone's Transport. `onNote` is called (in step with the
 * screen) as each drill note sounds, `onEnd` when it is over or stopped.
 */
export async function playDrill(
  drill: Drill,
  opts: ScheduleOptions & { onNote?: (index: number) => void; onEnd?: () => void } = {},
): Promise<Playback> {
  const Tone = await loadTone();
  await Tone.start();
  const transport = Tone.getTransport();
  transport.stop();
  transport.cancel(0);
  const voices = makeVoices(Tone);
  const { events, end } = scheduleDrill(drill, opts);
  const draw = Tone.getDraw();
  for (const e of events) {
    transport.schedule((time) => {
      voices.play(e, time);
      if (e.kind === 'note' && opts.onNote) draw.schedule(() => opts.onNote?.(e.index), time);
    }, e.time);
  }
  let stopped = false;
  const stop = () => {
    if (stopped) return;
    stopped = true;
    transport.stop();
    transport.cancel(0);
    draw.cancel(0);
    setTimeout(() => voices.dispose(), 500);
    opts.onEnd?.();
  };
  transport.schedule(() => draw.schedule(stop, Tone.now()), end + 0.3);
  transport.start('+0.05', 0);
  return { stop };
}

/**
 * Plays sounds already scheduled (a pair's scale over its chord, say) at once, stopping whatever
 * the Transport was playing; `onEnd` is called when it is over or stopped.
 */
export async function playSchedule(schedule: Schedule, opts: { onEnd?: () => void } = {}): Promise<Playback> {
  const Tone = await loadTone();
  await Tone.start();
  const transport = Tone.getTransport();
  transport.stop();
  transport.cancel(0);
  const voices = makeVoices(Tone);
  for (const e of schedule.events) transport.schedule((time) => voices.play(e, time), e.time);
  const draw = Tone.getDraw();
  let stopped = false;
  const stop = () => {
    if (stopped) return;
    stopped = true;
    transport.stop();
    transport.cancel(0);
    setTimeout(() => voices.dispose(), 500);
    opts.onEnd?.();
  };
  transport.schedule(() => draw.schedule(stop, Tone.now()), schedule.end);
  transport.start('+0.05', 0);
  return { stop };
}

/**
 * Renders the drill without any sound device (Tone.Offline on an OfflineAudioContext) and
 * returns it as WAV bytes: the "audio" download, and how tests hear the preview.
 */
export async function renderDrillWav(
  drill: Drill,
  opts: ScheduleOptions = {},
  sampleRate = 22050,
): Promise<Uint8Array> {
  const Tone = await loadTone();
  const { events, end } = scheduleDrill(drill, opts);
  const buffer = await Tone.Offline(
    ({ transport }) => {
      const voices = makeVoices(Tone);
      for (const e of events) transport.schedule((time) => voices.play(e, time), e.time);
      transport.start(0);
    },
    end + 0.5,
    1,
    sampleRate,
  );
  return encodeWav(buffer.getChannelData(0), sampleRate);
}
