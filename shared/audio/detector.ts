import { PitchDetector } from 'pitchy';
import { Midi } from 'tonal';
import { EngineError } from '../engine/errors';
import type { PlayedNote } from '../engine/types';

/** What to listen for: the concert range (MIDI numbers) and the noise gate in dBFS. */
export interface DetectOptions {
  /** lowest concert MIDI note to accept (default 36) */
  low?: number;
  /** highest concert MIDI note to accept (default 96) */
  high?: number;
  /** the noise gate in dBFS: quieter sound is never a note (default -45) */
  threshold?: number;
}

/**
 * Listens to a stream of samples block by block. `push` answers the notes whose onset has
 * become certain; each note's `durationMs` is filled in on that same object once the note ends
 * (in a later push, or in `flush` for the note still sounding at the end).
 */
export interface NoteDetector {
  push(block: Float32Array, blockStartMs: number): PlayedNote[];
  flush(): PlayedNote[];
  /** the level of the latest analysed stretch in dBFS (for a meter); -Infinity in silence */
  readonly levelDb: number;
}

export const DEFAULT_LOW = 36;
export const DEFAULT_HIGH = 96;
export const DEFAULT_THRESHOLD_DB = -45;

/** Analysis step: every 5 ms a level and a pitch. */
const HOP_MS = 5;
/** A note's pitch is the median of its first 60 ms (a bent attack and vibrato stay one note). */
const FIRST_MS = 60;
/** A new pitch, or a new sound from nothing, must hold this long to be an onset. */
const HOLD_MS = 30;
/** The level must stay under the gate this long to end a note (a short dip is not a rest). */
const GATE_HOLD_MS = 15;
/** The shortest note heard when the sound stops before its first 60 ms are over. */
const SHORTEST_MS = 30;
/** McLeod clarity below this is breath, key noise or a transition, not a pitch. */
const CLARITY = 0.8;
/** Semitones from a note's pitch that count as a new pitch (vibrato stays inside). */
const CHANGE = 0.6;
/** Semitones within which the frames of one new pitch agree. */
const SAME = 0.5;
/** Pitch is only worked out where the sound is at most this far under the gate. */
const PITCH_FLOOR_DB = 6;
/** Velocity 127 at this level (dBFS); velocity 1 at the gate. */
const LOUDEST_DB = -6;

interface Frame {
  ms: number;
  /** fractional MIDI number, or null when no clear pitch in range */
  pitch: number | null;
}

interface Active {
  note: PlayedNote;
  onsetMs: number;
  frames: Frame[];
  ref: number | null;
  peakDb: number;
}

interface Run {
  startMs: number;
  first: number;
  frames: Frame[];
  pitched: number;
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

const round1 = (x: number) => Math.round(x * 10) / 10;

function checkOptions(sampleRate: number, options: DetectOptions) {
  const low = options.low ?? DEFAULT_LOW;
  const high = options.high ?? DEFAULT_HIGH;
  const threshold = options.threshold ?? DEFAULT_THRESHOLD_DB;
  if (!Number.isFinite(sampleRate) || sampleRate < 8000 || sampleRate > 384000)
    throw new EngineError(`The sample rate must be between 8000 and 384000 Hz, not ${sampleRate}`);
  if (!Number.isFinite(low) || !Number.isFinite(high) || low < 0 || high > 127 || low >= high)
    throw new EngineError(`The range must run from a lower to a higher MIDI note within 0-127, not ${low}-${high}`);
  const nyquistMidi = 69 + 12 * Math.log2(sampleRate / 2 / 440);
  if (high > nyquistMidi - 12)
    throw new EngineError(`At ${sampleRate} Hz the highest note that can be heard is ${Math.floor(nyquistMidi - 12)}`);
  if (!Number.isFinite(threshold) || threshold > 0 || threshold < -100)
    throw new EngineError(`The gate is a level from -100 to 0 dBFS, not ${threshold}`);
  return { low, high, threshold };
}

/**
 * The streaming note detector: one melodic line at a time (a horn, a voice, a single keyboard
 * line). An onset is where the level rises through the gate, or where the pitch moves to
 * another semitone and holds for 30 ms; a note's MIDI number is the nearest semitone of the
 * median pitch over its first 60 ms; its velocity follows the onset's level; it lasts until
 * the level falls under the gate or the next onset. The pitch comes from the McLeod pitch
 * method (the `pitchy` package). Blocks of any size give the same notes as one block.
 *
 * @example
 * const detector = createNoteDetector(48000);
 * worklet.port.onmessage = (e) => notes.push(...detector.push(e.data.samples, e.data.startMs));
 */
export function createNoteDetector(sampleRate: number, options: DetectOptions = {}): NoteDetector {
  const { low, high, threshold } = checkOptions(sampleRate, options);
  const decimator = createDecimator(sampleRate);
  const rate = sampleRate / decimator.factor;
  const hop = Math.max(16, Math.round((rate * HOP_MS) / 1000));
  const hopMs = (hop * 1000) / rate;
  const lowHz = Midi.midiToFreq(low);
  // Two periods of the lowest note: the least the McLeod method needs.
  const win = 2 * Math.ceil(rate / lowHz);
  const levelLen = Math.ceil(rate * Math.max(0.01, 1 / lowHz));
  const levelMs = (levelLen * 1000) / rate;
  const gateAmp = 10 ** (threshold / 20);
  const holdFrames = Math.ceil(HOLD_MS / hopMs);
  const gateHoldHops = Math.ceil(GATE_HOLD_MS / hopMs);
  const pitcher = PitchDetector.forFloat32Array(win);
  const window = new Float32Array(Math.max(win, levelLen));

  let buf = new Float32Array(Math.max(4 * win, 8192));
  let bufStart = 0; // index of buf[0] among the analysed (decimated) samples
  let total = 0; // analysed samples so far
  let received = 0; // samples received
  let nextHop = 0;
  // Time of a received sample: the newest anchor at or before it, counting samples from there.
  let anchors: Array<{ sample: number; ms: number }> = [];
  let levelDb = Number.NEGATIVE_INFINITY;

  let gateOpen = false;
  let underHops = 0;
  let underMs = 0;
  let active: Active | null = null;
  let run: Run | null = null;
  let lastNearMs = Number.NEGATIVE_INFINITY;
  let lastEndMs = Number.NEGATIVE_INFINITY;
  let out: PlayedNote[] = [];

  const sample = (i: number) => (i < bufStart || i >= total ? 0 : buf[i - bufStart]);
  /** The time of an analysed sample (it stands for the received sample at the filter's centre). */
  const msAt = (j: number) => {
    const s = j * decimator.factor - decimator.delay;
    let a = anchors[0];
    for (let i = anchors.length - 1; i > 0; i--) {
      if (anchors[i].sample <= s) {
        a = anchors[i];
        break;
      }
    }
    return a.ms + ((s - a.sample) * 1000) / sampleRate;
  };
  const needEnd = (k: number) => Math.max((k + 1) * hop, Math.round((k + 0.5) * hop) + win / 2);

  /** Samples [from, from + n) of the analysed signal, zeros outside what has arrived. */
  const slice = (from: number, n: number): Float32Array => {
    if (from >= bufStart && from + n <= total) return buf.subarray(from - bufStart, from - bufStart + n);
    for (let i = 0; i < n; i++) window[i] = sample(from + i);
    return window.subarray(0, n);
  };

  const levelAt = (end: number) => {
    const xs = slice(end - levelLen, levelLen);
    let sum = 0;
    for (let i = 0; i < xs.length; i++) sum += xs[i] * xs[i];
    return sum > 0 ? 10 * Math.log10(sum / levelLen) : Number.NEGATIVE_INFINITY;
  };

  const pitchAt = (center: number): number | null => {
    const xs = slice(center - win / 2, win);
    let sum = 0;
    for (let i = 0; i < xs.length; i++) sum += xs[i] * xs[i];
    if (sum === 0 || 10 * Math.log10(sum / win) < threshold - PITCH_FLOOR_DB) return null;
    const [hz, clarity] = pitcher.findPitch(xs, rate);
    if (clarity < CLARITY || !(hz > 0)) return null;
    const midi = 69 + 12 * Math.log2(hz / 440);
    return midi >= low - 0.5 && midi <= high + 0.5 ? midi : null;
  };

  const velocity = (db: number) =>
    Math.max(1, Math.min(127, Math.round(1 + (126 * (db - threshold)) / (LOUDEST_DB - threshold))));

  const begin = (onsetMs: number, frames: Frame[], db: number) => {
    active = { note: { midi: 0, timeMs: round1(onsetMs) }, onsetMs, frames, ref: null, peakDb: db };
  };

  /** Decides the note's pitch from its first frames; false when they hold too little pitch. */
  const confirm = (a: Active, atEnd: boolean): boolean => {
    const pitches = a.frames.filter((f) => f.pitch !== null).map((f) => f.pitch as number);
    const enough = atEnd ? pitches.length >= 3 : pitches.length >= Math.max(3, 0.4 * a.frames.length);
    if (!enough) return false;
    a.ref = median(pitches);
    a.note.midi = Math.round(a.ref);
    a.note.velocity = velocity(a.peakDb);
    out.push(a.note);
    return true;
  };

  const end = (endMs: number) => {
    const a = active;
    active = null;
    if (!a) return;
    if (a.ref === null && (endMs - a.onsetMs < SHORTEST_MS || !confirm(a, true))) return;
    a.note.durationMs = round1(Math.max(0, endMs - a.onsetMs));
    lastEndMs = endMs;
  };

  const step = (k: number) => {
    const hopEnd = (k + 1) * hop;
    const center = Math.round((k + 0.5) * hop);
    const db = levelAt(hopEnd);
    levelDb = db;
    const tc = msAt(center);
    const endMs = msAt(hopEnd);

    // The gate: open when the level reaches it, closed after it stays under for a moment.
    if (db >= threshold) {
      underHops = 0;
      if (!gateOpen) {
        gateOpen = true;
        if (!active) {
          // The first sample as loud as the gate in the level's window is the onset.
          let onset = hopEnd - levelLen;
          while (onset < hopEnd - 1 && Math.abs(sample(onset)) < gateAmp) onset++;
          begin(Math.max(msAt(onset), lastEndMs), [], db);
          run = null;
        }
      }
    } else if (gateOpen) {
      underHops++;
      // The trailing level window still held the sound for its length after the sound stopped.
      if (underHops === 1) underMs = Math.max(endMs - levelMs, active ? active.onsetMs : endMs - levelMs);
      if (underHops >= gateHoldHops) {
        gateOpen = false;
        end(underMs);
        run = null;
      }
    }
    if (!gateOpen) return;

    // A held note whose last frame sat on its pitch: every other frame is enough to notice a
    // change (a new pitch is then followed frame by frame until it holds or goes away).
    const held = active as Active | null;
    if (held && held.ref !== null && !run && lastNearMs === msAt(center - hop) && k % 2 === 1) {
      if (tc < held.onsetMs + HOLD_MS) held.peakDb = Math.max(held.peakDb, db);
      return;
    }
    const frame: Frame = { ms: tc, pitch: pitchAt(center) };
    const a = active as Active | null;
    if (a) {
      if (tc >= a.onsetMs && tc < a.onsetMs + HOLD_MS) a.peakDb = Math.max(a.peakDb, db);
      if (a.ref === null) {
        if (tc < a.onsetMs + FIRST_MS) {
          if (tc >= a.onsetMs) a.frames.push(frame);
          return;
        }
        // The first 60 ms are in: a note, or noise that opened the gate (then listen on).
        if (!confirm(a, false)) active = null;
        else {
          a.frames = [];
          lastNearMs = Number.NEGATIVE_INFINITY;
        }
      }
    }

    // A run of frames at one new pitch: a new note once it holds.
    const cur = active as Active | null;
    const ref = cur?.ref ?? null;
    const p = frame.pitch;
    if (p !== null && ref !== null && Math.abs(p - ref) < CHANGE) {
      run = null;
      lastNearMs = tc;
      return;
    }
    if (p === null) {
      if (run) run.frames.push(frame);
    } else if (run && Math.abs(p - run.first) <= SAME) {
      run.frames.push(frame);
      run.pitched++;
    } else {
      run = { startMs: tc, first: p, frames: [frame], pitched: 1 };
    }
    if (run && run.frames.length >= holdFrames && run.pitched * 2 >= run.frames.length) {
      const r = run;
      run = null;
      // Across a slur the frames between the two pitches hold no clear pitch: the change is
      // halfway between the last frame of the old pitch and the first of the new one.
      const onsetMs = cur ? Math.max(r.startMs - HOLD_MS, (lastNearMs + r.startMs) / 2) : r.startMs;
      if (cur) end(onsetMs);
      begin(onsetMs, r.frames, db);
    }
  };

  const prune = () => {
    const keep = Math.min(Math.round((nextHop + 0.5) * hop) - win / 2, (nextHop + 1) * hop - levelLen) - 1;
    if (keep - bufStart > buf.length / 2) {
      buf.copyWithin(0, keep - bufStart, total - bufStart);
      bufStart = keep;
    }
    const oldest = keep * decimator.factor - decimator.delay;
    let i = 0;
    while (i + 1 < anchors.length && anchors[i + 1].sample <= oldest) i++;
    if (i > 0) anchors = anchors.slice(i);
  };

  const append = (samples: Float32Array) => {
    if (total + samples.length - bufStart > buf.length) {
      const bigger = new Float32Array(Math.max(buf.length * 2, total + samples.length - bufStart));
      bigger.set(buf.subarray(0, total - bufStart));
      buf = bigger;
    }
    buf.set(samples, total - bufStart);
    total += samples.length;
  };

  const take = () => {
    const notes = out;
    out = [];
    return notes;
  };

  return {
    get levelDb() {
      return levelDb;
    },
    push(block, blockStartMs) {
      if (!(block instanceof Float32Array)) throw new EngineError('A block of samples must be a Float32Array');
      if (!Number.isFinite(blockStartMs)) throw new EngineError('A block needs the time of its first sample');
      // A gap or a jump in the clock starts a new anchor; contiguous blocks keep the first one.
      const last = anchors.at(-1);
      const expected = last ? last.ms + ((received - last.sample) * 1000) / sampleRate : null;
      if (expected === null || Math.abs(expected - blockStartMs) > (2 * 1000) / sampleRate)
        anchors.push({ sample: received, ms: blockStartMs });
      received += block.length;
      append(decimator.push(block));
      while (needEnd(nextHop) <= total) step(nextHop++);
      prune();
      return take();
    },
    flush() {
      if (anchors.length === 0) return take();
      append(decimator.flush());
      while (nextHop * hop < total) step(nextHop++);
      if (active) end(gateOpen && underHops > 0 ? underMs : msAt(total));
      gateOpen = false;
      run = null;
      return take();
    },
  };
}

/**
 * Brings the sample rate down to about 16 kHz before analysis (a horn's pitch lies far below
 * 8 kHz): a windowed-sinc low-pass, then every n-th sample. The same samples come out whatever
 * the blocks. Output j stands for input sample j x factor - delay.
 */
function createDecimator(sampleRate: number) {
  const factor = Math.max(1, Math.ceil(sampleRate / 16500));
  if (factor === 1) {
    return {
      factor,
      delay: 0,
      push: (block: Float32Array) => block,
      flush: () => new Float32Array(0),
    };
  }
  const taps = 8 * factor + 1;
  const delay = (taps - 1) / 2;
  const cutoff = 0.45 / factor; // cycles per input sample
  const h = new Float32Array(taps);
  let norm = 0;
  for (let m = 0; m < taps; m++) {
    const x = m - delay;
    const sinc = x === 0 ? 2 * cutoff : Math.sin(2 * Math.PI * cutoff * x) / (Math.PI * x);
    const blackman =
      0.42 - 0.5 * Math.cos((2 * Math.PI * m) / (taps - 1)) + 0.08 * Math.cos((4 * Math.PI * m) / (taps - 1));
    h[m] = sinc * blackman;
    norm += h[m];
  }
  for (let m = 0; m < taps; m++) h[m] /= norm;
  // The last taps - 1 input samples, then the new block; outputs go to a reused buffer.
  const keep = taps - 1;
  let input = new Float32Array(keep + 4096);
  let output = new Float32Array(Math.ceil(4096 / factor) + 1);
  let received = 0;
  let next = 0; // index of the next output
  const run = (block: Float32Array) => {
    if (keep + block.length > input.length) {
      const bigger = new Float32Array(keep + block.length);
      bigger.set(input.subarray(0, keep));
      input = bigger;
      output = new Float32Array(Math.ceil(block.length / factor) + 1);
    }
    input.set(block, keep);
    const base = received - keep; // input index of input[0]
    received += block.length;
    let n = 0;
    while (next * factor < received) {
      // input[i - m] for m = 0..taps-1; before the first sample the history holds zeros.
      const i = next * factor - base;
      let acc = 0;
      for (let m = 0; m < taps; m++) acc += h[m] * input[i - m];
      output[n++] = acc;
      next++;
    }
    input.copyWithin(0, block.length, block.length + keep);
    return output.subarray(0, n);
  };
  return {
    factor,
    delay,
    push: run,
    // The filter's delay: feed silence so the last received samples reach the output.
    flush: () => run(new Float32Array(delay + factor)),
  };
}

/**
 * The notes of a recording, as the streaming detector would hear them.
 *
 * @example
 * detectNotes(samples, 48000) // [{ midi: 67, timeMs: 12.5, velocity: 88, durationMs: 410 }, ...]
 */
export function detectNotes(samples: Float32Array, sampleRate: number, options: DetectOptions = {}): PlayedNote[] {
  const detector = createNoteDetector(sampleRate, options);
  return [...detector.push(samples, 0), ...detector.flush()];
}
