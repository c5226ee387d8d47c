import { createNoteDetector, DEFAULT_THRESHOLD_DB, type NoteDetector } from '@shared/audio';
import type { PlayedNote } from '@shared/engine';
import micTapUrl from './audio/mic-tap.worklet.ts?worker&url';
import type { NoteInput } from './midi-input';

/**
 * The microphone as a note input, for a horn, a voice or any single line: an AudioWorklet
 * posts the samples, the note detector turns them into notes, and each note reaches the page's
 * NoteInput (source 'mic') stamped with the time of its onset, like a MIDI event. The browser
 * asks for the microphone only when the player picks it.
 */
export type MicStatus =
  | { state: 'off' }
  | { state: 'starting' }
  | { state: 'listening'; message: string }
  | { state: 'unsupported' | 'denied' | 'no-device' | 'failed'; message: string };

/** The name the microphone's latency is stored under, beside the MIDI devices' names. */
export const MIC_DEVICE_NAME = 'Microphone';

export const GATE_MIN_DB = -70;
export const GATE_MAX_DB = -20;

/**
 * What a capture must not do to a horn: echo cancellation and noise suppression eat sustained
 * tones and soften onsets, automatic gain moves the level the gate compares against.
 */
export const MIC_CONSTRAINTS: MediaTrackConstraints = {
  echoCancellation: false,
  noiseSuppression: false,
  autoGainControl: false,
  channelCount: 1,
};

const STORAGE_KEY = 'sixfold.mic';

const FALLBACK = 'Meanwhile, play with a MIDI device or the on-screen or computer keyboard.';

/** Turns a refusal of the microphone into words a player can act on. */
export function describeMicFailure(err: unknown): MicStatus {
  const name =
    typeof err === 'object' && err && 'name' in err ? String((err as { name: unknown }).name) : String(err ?? '');
  if (name === 'NotAllowedError' || name === 'SecurityError' || name === 'PermissionDeniedError') {
    return {
      state: 'denied',
      message: `The microphone was refused. Allow it for this site in the browser (the icon by the address bar), then pick Microphone again. ${FALLBACK}`,
    };
  }
  if (name === 'NotFoundError' || name === 'OverconstrainedError' || name === 'DevicesNotFoundError') {
    return {
      state: 'no-device',
      message: `No microphone was found. Plug one in or turn it on, then pick Microphone again. ${FALLBACK}`,
    };
  }
  if (name === 'NotReadableError' || name === 'TrackStartError') {
    return {
      state: 'failed',
      message: `The microphone is busy or blocked by the system (another program may be using it). Close that program, then pick Microphone again. ${FALLBACK}`,
    };
  }
  return { state: 'failed', message: `The microphone could not start (${name || 'unknown error'}). ${FALLBACK}` };
}

/** The gate, and whether the player was listening through the microphone last time. */
function loadRemembered(): { gateDb: number; on: boolean } {
  let gateDb = DEFAULT_THRESHOLD_DB;
  let on = false;
  try {
    const raw = JSON.parse(localStorage.getItem(STORAGE_KEY) ?? '{}');
    const gate = Number(raw.gateDb);
    if (Number.isFinite(gate) && gate >= GATE_MIN_DB && gate <= GATE_MAX_DB) gateDb = gate;
    on = raw.on === true;
  } catch {}
  return { gateDb, on };
}

type Listener<T> = (value: T) => void;

export class MicInput {
  private status: MicStatus = { state: 'off' };
  private statusListeners = new Set<Listener<MicStatus>>();
  private levelListeners = new Set<Listener<number>>();
  private gate = loadRemembered().gateDb;
  private remembered = loadRemembered().on;
  private stream: MediaStream | null = null;
  private context: AudioContext | null = null;
  private node: AudioWorkletNode | null = null;
  private detector: NoteDetector | null = null;
  /** performance.now() less the context's clock, in ms (the smallest seen: the least delayed block) */
  private offsetMs: number | null = null;
  /** notes sent as 'on' whose end is not known yet */
  private sounding: PlayedNote[] = [];
  private attempt = 0;

  constructor(private notes: NoteInput) {}

  getStatus(): MicStatus {
    return this.status;
  }

  get gateDb(): number {
    return this.gate;
  }

  get on(): boolean {
    return this.status.state === 'listening' || this.status.state === 'starting';
  }

  onStatus(fn: Listener<MicStatus>): () => void {
    this.statusListeners.add(fn);
    fn(this.status);
    return () => this.statusListeners.delete(fn);
  }

  /** The input level in dBFS, about 50 times a second while listening. */
  onLevel(fn: Listener<number>): () => void {
    this.levelListeners.add(fn);
    return () => this.levelListeners.delete(fn);
  }

  /** Asks for the microphone (the browser's own question) and starts listening. */
  async start(): Promise<MicStatus> {
    if (this.on) return this.status;
    const attempt = ++this.attempt;
    const media = typeof navigator === 'undefined' ? undefined : navigator.mediaDevices;
    if (!media?.getUserMedia || typeof AudioWorkletNode === 'undefined') {
      return this.setStatus({
        state: 'unsupported',
        message: `This browser cannot listen through a microphone here (it needs a secure page and audio worklets). ${FALLBACK}`,
      });
    }
    this.setStatus({ state: 'starting' });
    // Made at once, inside the player's click, so the browser lets it sound.
    let context: AudioContext;
    try {
      context = new AudioContext({ latencyHint: 'interactive' });
    } catch (err) {
      return this.setStatus(describeMicFailure(err));
    }
    const giveUp = (stream: MediaStream | null) => {
      for (const t of stream?.getTracks() ?? []) t.stop();
      void context.close().catch(() => undefined);
    };
    let stream: MediaStream;
    try {
      stream = await media.getUserMedia({ audio: MIC_CONSTRAINTS, video: false });
    } catch (err) {
      giveUp(null);
      return attempt === this.attempt ? this.setStatus(describeMicFailure(err)) : this.status;
    }
    try {
      await context.audioWorklet.addModule(micTapUrl);
      if (attempt !== this.attempt) {
        giveUp(stream);
        return this.status;
      }
      const source = context.createMediaStreamSource(stream);
      const node = new AudioWorkletNode(context, 'sixfold-mic-tap', { numberOfInputs: 1, numberOfOutputs: 1 });
      // A silent path to the output keeps the browser pulling audio through the tap.
      const mute = context.createGain();
      mute.gain.value = 0;
      source.connect(node).connect(mute).connect(context.destination);
      node.port.onmessage = (e: MessageEvent<{ samples: Float32Array; startFrame: number }>) =>
        this.onBlock(e.data.samples, e.data.startFrame);
      if (context.state === 'suspended') {
        await context.resume().catch(() => undefined);
        // Still asleep after a long permission question: the next click wakes it.
        if (context.state === 'suspended')
          window.addEventListener('pointerdown', () => void context.resume().catch(() => undefined), { once: true });
      }
      this.stream = stream;
      this.context = context;
      this.node = node;
      this.detector = createNoteDetector(context.sampleRate, { threshold: this.gate });
      this.offsetMs = null;
      const track = stream.getAudioTracks()[0];
      track?.addEventListener('ended', () => {
        if (this.stream !== stream) return;
        this.stop();
        this.setStatus({
          state: 'no-device',
          message: `The microphone was disconnected. Plug it back in and pick Microphone again. ${FALLBACK}`,
        });
      });
      this.remember(true);
      const label = track?.label ? ` (${track.label})` : '';
      return this.setStatus({ state: 'listening', message: `Listening through the microphone${label}.` });
    } catch (err) {
      giveUp(stream);
      return attempt === this.attempt ? this.setStatus(describeMicFailure(err)) : this.status;
    }
  }

  /**
   * Listens again when the player chose the microphone last time and the browser already
   * allows it (so no question pops up that the player did not ask for).
   */
  async resumeIfChosen(): Promise<MicStatus> {
    if (!this.remembered || this.on) return this.status;
    const attempt = this.attempt;
    try {
      const permission = await navigator.permissions?.query({ name: 'microphone' as PermissionName });
      if (permission?.state !== 'granted') return this.status;
    } catch {
      return this.status;
    }
    // Stopped or picked again while the browser answered: leave it as it is.
    if (attempt !== this.attempt) return this.status;
    return this.start();
  }

  /** The player chose another input: stop, and do not come back to the microphone next time. */
  forget() {
    this.remember(false);
    this.stop();
  }

  /** Stops listening and lets the microphone go (the browser's indicator goes out). */
  stop() {
    this.attempt++;
    this.endSounding();
    if (this.node) this.node.port.onmessage = null;
    for (const t of this.stream?.getTracks() ?? []) t.stop();
    void this.context?.close().catch(() => undefined);
    this.stream = null;
    this.context = null;
    this.node = null;
    this.detector = null;
    if (this.status.state !== 'off') this.setStatus({ state: 'off' });
  }

  /** The gate in dBFS: quieter sound (the room, breath, keys) is never a note. */
  setGate(db: number) {
    this.gate = Math.max(GATE_MIN_DB, Math.min(GATE_MAX_DB, Math.round(db)));
    this.remember(this.remembered);
    if (this.detector && this.context) {
      // A new gate starts a new detector; what the old one still held is ended now.
      this.endSounding();
      this.detector = createNoteDetector(this.context.sampleRate, { threshold: this.gate });
    }
    this.emitStatus();
  }

  private remember(on: boolean) {
    this.remembered = on;
    try {
      localStorage.setItem(STORAGE_KEY, JSON.stringify({ gateDb: this.gate, on }));
    } catch {}
  }

  private onBlock(samples: Float32Array, startFrame: number) {
    const context = this.context;
    const detector = this.detector;
    if (!context || !detector) return;
    const startMs = (startFrame * 1000) / context.sampleRate;
    // The block's last sample was heard just before it arrived: the least delayed block gives
    // the two clocks' offset. It drifts by a few ms an hour, so it may creep upward slowly.
    const seen = performance.now() - (startMs + (samples.length * 1000) / context.sampleRate);
    this.offsetMs = this.offsetMs === null ? seen : Math.min(seen, this.offsetMs + 0.01);
    const offset = this.offsetMs;
    for (const n of detector.push(samples, startMs)) {
      this.notes.micNote('on', n.midi, n.timeMs + offset, n.velocity);
      this.sounding.push(n);
    }
    this.sounding = this.sounding.filter((n) => {
      if (n.durationMs === undefined) return true;
      this.notes.micNote('off', n.midi, n.timeMs + n.durationMs + offset);
      return false;
    });
    for (const fn of this.levelListeners) fn(detector.levelDb);
  }

  private endSounding() {
    const offset = this.offsetMs ?? 0;
    for (const n of this.sounding)
      this.notes.micNote(
        'off',
        n.midi,
        n.durationMs === undefined ? performance.now() : n.timeMs + n.durationMs + offset,
      );
    this.sounding = [];
  }

  private setStatus(s: MicStatus): MicStatus {
    this.status = s;
    this.emitStatus();
    return s;
  }

  private emitStatus() {
    for (const fn of this.statusListeners) fn(this.status);
  }
}
