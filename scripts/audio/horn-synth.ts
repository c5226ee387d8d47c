import * as wavefileModule from 'wavefile';

// A CommonJS package: its class arrives as a named export or on the default one, by loader.
const { WaveFile } = (
  'WaveFile' in wavefileModule ? wavefileModule : (wavefileModule as { default: typeof wavefileModule }).default
) as typeof wavefileModule;

/**
 * A small synthesizer of horn-like lines for testing the note detector: a harmonic tone with
 * a shaped attack and release, vibrato, scooped (bent) attacks, slurred (legato) and detached
 * notes, breath noise and a noise floor. Deterministic: the same phrase gives the same samples.
 */
export interface SynthNote {
  midi: number;
  startMs: number;
  durationMs: number;
  /** RMS level of the tone in dBFS (default -18) */
  db?: number;
  /** slurred from the previous note: no new attack, a quick glide in pitch */
  legato?: boolean;
  vibrato?: { hz: number; cents: number };
  /** the attack starts this many cents off the note and glides to it */
  bend?: { cents: number; ms: number };
  attackMs?: number;
}

export interface Phrase {
  name: string;
  description: string;
  sampleRate: number;
  notes: SynthNote[];
  /** background noise in dBFS RMS */
  noiseDb: number;
  /** breath noise while a note sounds, in dB under the tone (default -30) */
  breathDb?: number;
  /** length of the recording (default: the last note's end + 250 ms) */
  lengthMs?: number;
  seed: number;
}

export interface ExpectedNote {
  midi: number;
  timeMs: number;
  durationMs: number;
}

/** A brass-like spectrum: a strong fundamental and a slowly falling row of harmonics. */
const HARMONICS = [1, 0.8, 0.6, 0.45, 0.3, 0.2, 0.12, 0.08];
const HARMONIC_RMS = Math.sqrt(HARMONICS.reduce((s, a) => s + a * a, 0) / 2);
const RELEASE_MS = 25;
const GLIDE_MS = 12;

function mulberry32(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Roughly Gaussian noise with unit RMS. */
function gaussian(rand: () => number) {
  return (rand() + rand() + rand() + rand() - 2) * Math.sqrt(3);
}

const hz = (midi: number) => 440 * 2 ** ((midi - 69) / 12);
const smooth = (x: number) => (x <= 0 ? 0 : x >= 1 ? 1 : 0.5 - 0.5 * Math.cos(Math.PI * x));

/** The expected notes: each starts where it is written; a slurred one ends the note before it. */
export function expectedNotes(phrase: Phrase): ExpectedNote[] {
  return phrase.notes.map((n, i) => {
    const next = phrase.notes[i + 1];
    const durationMs = next?.legato ? next.startMs - n.startMs : n.durationMs;
    return { midi: n.midi, timeMs: n.startMs, durationMs };
  });
}

export function renderPhrase(phrase: Phrase): Float32Array {
  const sr = phrase.sampleRate;
  const last = phrase.notes.at(-1);
  const lengthMs = phrase.lengthMs ?? (last ? last.startMs + last.durationMs + 250 : 500);
  const out = new Float32Array(Math.ceil((lengthMs * sr) / 1000));
  const rand = mulberry32(phrase.seed);
  const noiseAmp = 10 ** (phrase.noiseDb / 20);
  for (let i = 0; i < out.length; i++) out[i] = noiseAmp * gaussian(rand);

  // Each slurred group is one breath: one oscillator, one attack, one release.
  const groups: SynthNote[][] = [];
  for (const n of phrase.notes) {
    if (n.legato && groups.length > 0) groups[groups.length - 1].push(n);
    else groups.push([n]);
  }
  const breath = 10 ** ((phrase.breathDb ?? -30) / 20);
  for (const group of groups) {
    const first = group[0];
    const lastNote = group[group.length - 1];
    const startMs = first.startMs;
    const endMs = lastNote.startMs + lastNote.durationMs;
    const attackMs = first.attackMs ?? 25;
    let phase = rand() * 2 * Math.PI;
    let k = 0;
    const i0 = Math.floor((startMs * sr) / 1000);
    const i1 = Math.min(out.length, Math.ceil((endMs * sr) / 1000));
    for (let i = i0; i < i1; i++) {
      const t = (i * 1000) / sr;
      while (k + 1 < group.length && t >= group[k + 1].startMs - GLIDE_MS / 2) k++;
      const note = group[k];
      const since = t - note.startMs;
      // Pitch: the note, a glide from the previous slurred note, a scoop, vibrato.
      let midi = note.midi;
      if (note.legato && k > 0 && since < GLIDE_MS / 2) {
        const prev = group[k - 1].midi;
        midi = prev + (note.midi - prev) * smooth((since + GLIDE_MS / 2) / GLIDE_MS);
      }
      if (note.bend && since < note.bend.ms)
        midi += (note.bend.cents / 100) * (1 - smooth(Math.max(0, since) / note.bend.ms));
      if (note.vibrato) {
        const depth = smooth(Math.max(0, since) / 120);
        midi += (note.vibrato.cents / 100) * depth * Math.sin(2 * Math.PI * note.vibrato.hz * (since / 1000));
      }
      phase += (2 * Math.PI * hz(midi)) / sr;
      // Level: attack, the note's own level (eased across a slur), release.
      const db = note.db ?? -18;
      const prevDb = k > 0 ? (group[k - 1].db ?? -18) : db;
      const levelDb = since < 20 ? prevDb + (db - prevDb) * smooth(since / 20) : db;
      const amp =
        (10 ** (levelDb / 20) / HARMONIC_RMS) * smooth((t - startMs) / attackMs) * smooth((endMs - t) / RELEASE_MS);
      let s = 0;
      const f = hz(midi);
      for (let h = 0; h < HARMONICS.length; h++) {
        if ((h + 1) * f > sr * 0.45) break;
        s += HARMONICS[h] * Math.sin((h + 1) * phase);
      }
      out[i] += amp * (s + breath * HARMONIC_RMS * gaussian(rand));
    }
  }
  return out;
}

/** 16-bit PCM mono WAV bytes. */
export function toWav(samples: Float32Array, sampleRate: number): Uint8Array {
  const ints = new Int16Array(samples.length);
  for (let i = 0; i < samples.length; i++) ints[i] = Math.round(Math.max(-1, Math.min(1, samples[i])) * 32767);
  const wav = new WaveFile();
  wav.fromScratch(1, sampleRate, '16', ints);
  return wav.toBuffer();
}

/** The first channel of a PCM WAV file as floats in -1..1, with its sample rate. */
export function readWav(bytes: Uint8Array): { samples: Float32Array; sampleRate: number } {
  const wav = new WaveFile(bytes);
  wav.toBitDepth('32f');
  const fmt = wav.fmt as { sampleRate: number; numChannels: number };
  const all = wav.getSamples(false, Float32Array) as unknown as Float32Array | Float32Array[];
  const samples = fmt.numChannels > 1 ? (all as Float32Array[])[0] : (all as Float32Array);
  return { samples: Float32Array.from(samples), sampleRate: fmt.sampleRate };
}
