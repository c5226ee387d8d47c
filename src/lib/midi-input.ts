import { type Input, WebMidi } from 'webmidi';
import { computerKeyMap, octaveDownKey, octaveUpKey, parseMidiMessage } from './midi-messages';

/**
 * Every way a note reaches Sixfold — a MIDI device through webmidi, the on-screen keyboard, the
 * computer keyboard — ends in the same `NoteEvent`, stamped with the time the event itself
 * carries (performance.now's clock), never the time a handler happened to run.
 */
export interface NoteEvent {
  type: 'on' | 'off';
  midi: number;
  velocity: number;
  /** DOMHighResTimeStamp of the event, on performance.now()'s clock */
  timeStamp: number;
  source: 'midi' | 'screen' | 'keys' | 'mic';
  deviceId: string | null;
}

export interface MidiDevice {
  id: string;
  name: string;
  manufacturer: string;
}

export type InputStatus =
  | { state: 'idle' }
  | { state: 'starting' }
  | { state: 'ready'; devices: MidiDevice[]; selected: string | null; message: string }
  | { state: 'unsupported' | 'denied' | 'unavailable' | 'failed'; message: string };

type NoteListener = (e: NoteEvent) => void;
type StatusListener = (s: InputStatus) => void;
type BreathListener = (value: number, timeStamp: number) => void;

const STORAGE_KEY = 'sixfold.midi-input';

interface Remembered {
  deviceName: string | null;
  channel: number | 'all';
}

function loadRemembered(): Remembered {
  try {
    const raw = localStorage.getItem(STORAGE_KEY);
    if (raw) return { deviceName: null, channel: 'all', ...JSON.parse(raw) };
  } catch {}
  return { deviceName: null, channel: 'all' };
}

/** Turns a refusal of Web MIDI into words a player can act on. */
export function describeMidiFailure(err: unknown): InputStatus {
  const name =
    err instanceof Error || (typeof err === 'object' && err && 'name' in err)
      ? String((err as { name: unknown }).name)
      : '';
  if (name === 'NotAllowedError' || name === 'SecurityError') {
    return {
      state: 'denied',
      message:
        'MIDI access was refused. Allow MIDI for this site in the browser (the icon by the address bar), then reload. Meanwhile, play with the on-screen or computer keyboard.',
    };
  }
  if (name === 'InvalidStateError') {
    return {
      state: 'unavailable',
      message:
        'This computer has no working MIDI system, so no device can be reached. Check the interface and its driver, or play with the on-screen or computer keyboard.',
    };
  }
  return {
    state: 'failed',
    message: `MIDI could not start (${name || 'unknown error'}). Play with the on-screen or computer keyboard instead.`,
  };
}

/**
 * The note input for a page: MIDI devices with hot-plug, a channel choice and the last device
 * remembered, plus the on-screen and computer keyboards feeding the same listeners.
 */
export class NoteInput {
  private noteListeners = new Set<NoteListener>();
  private statusListeners = new Set<StatusListener>();
  private breathListeners = new Set<BreathListener>();
  private status: InputStatus = { state: 'idle' };
  private selected: Input | null = null;
  private remembered = loadRemembered();
  private keyOctave = 4;
  private heldKeys = new Map<string, number>();
  private onMidiMessage = (e: { message: { data: Uint8Array }; timestamp: number; target: Input }) =>
    this.handleMessage(e);

  getStatus(): InputStatus {
    return this.status;
  }

  get channel(): number | 'all' {
    return this.remembered.channel;
  }

  onNote(fn: NoteListener): () => void {
    this.noteListeners.add(fn);
    return () => this.noteListeners.delete(fn);
  }

  onStatus(fn: StatusListener): () => void {
    this.statusListeners.add(fn);
    fn(this.status);
    return () => this.statusListeners.delete(fn);
  }

  onBreath(fn: BreathListener): () => void {
    this.breathListeners.add(fn);
    return () => this.breathListeners.delete(fn);
  }

  /** Asks the browser for MIDI; any refusal leaves the keyboards working and says why. */
  async start(): Promise<InputStatus> {
    if (this.status.state === 'ready' || this.status.state === 'starting') return this.status;
    if (!WebMidi.supported) {
      return this.setStatus({
        state: 'unsupported',
        message:
          'This browser has no Web MIDI. Chromium-based browsers have it; until then, play with the on-screen or computer keyboard.',
      });
    }
    this.setStatus({ state: 'starting' });
    try {
      if (!WebMidi.enabled) await WebMidi.enable({ sysex: false });
    } catch (err) {
      return this.setStatus(describeMidiFailure(err));
    }
    WebMidi.addListener('connected', () => this.refreshDevices());
    WebMidi.addListener('disconnected', () => this.refreshDevices());
    this.refreshDevices();
    return this.status;
  }

  /** Chooses a device by id (null: none). The choice is remembered by name across visits. */
  selectDevice(id: string | null) {
    this.detach();
    const input = id ? (WebMidi.getInputById(id) ?? null) : null;
    if (input) {
      this.selected = input;
      input.addListener('midimessage', this.onMidiMessage as never);
    }
    this.remember({ deviceName: input ? input.name : null });
    this.refreshDevices(false);
  }

  /** Listens on one channel (1-16) or on all of them. */
  setChannel(channel: number | 'all') {
    this.remember({ channel });
    this.emitStatus();
  }

  /** The on-screen keyboard's way in. */
  screenNote(type: 'on' | 'off', midi: number, timeStamp: number, velocity = 90) {
    this.emit({ type, midi, velocity: type === 'on' ? velocity : 0, timeStamp, source: 'screen', deviceId: null });
  }

  /** The microphone's way in (src/lib/mic-input.ts): notes heard, on performance.now()'s clock. */
  micNote(type: 'on' | 'off', midi: number, timeStamp: number, velocity = 90) {
    this.emit({ type, midi, velocity: type === 'on' ? velocity : 0, timeStamp, source: 'mic', deviceId: null });
  }

  /** The computer keyboard's way in: call from keydown / keyup. Returns true when it was a note key. */
  computerKey(e: Pick<KeyboardEvent, 'code' | 'type' | 'repeat' | 'timeStamp'>): boolean {
    if (e.code === octaveDownKey || e.code === octaveUpKey) {
      if (e.type === 'keydown' && !e.repeat)
        this.keyOctave = Math.max(1, Math.min(7, this.keyOctave + (e.code === octaveUpKey ? 1 : -1)));
      return true;
    }
    const offset = computerKeyMap[e.code];
    if (offset === undefined) return false;
    if (e.type === 'keydown') {
      if (e.repeat || this.heldKeys.has(e.code)) return true;
      const midi = (this.keyOctave + 1) * 12 + offset;
      this.heldKeys.set(e.code, midi);
      this.emit({ type: 'on', midi, velocity: 90, timeStamp: e.timeStamp, source: 'keys', deviceId: null });
    } else {
      const midi = this.heldKeys.get(e.code);
      this.heldKeys.delete(e.code);
      if (midi !== undefined)
        this.emit({ type: 'off', midi, velocity: 0, timeStamp: e.timeStamp, source: 'keys', deviceId: null });
    }
    return true;
  }

  get keyboardOctave() {
    return this.keyOctave;
  }

  dispose() {
    this.detach();
    this.noteListeners.clear();
    this.statusListeners.clear();
    this.breathListeners.clear();
  }

  private detach() {
    if (this.selected) {
      try {
        this.selected.removeListener('midimessage', this.onMidiMessage as never);
      } catch {}
    }
    this.selected = null;
  }

  private handleMessage(e: { message: { data: Uint8Array }; timestamp: number; target: Input }) {
    const msg = parseMidiMessage(e.message.data);
    if (msg.kind === 'other' || msg.kind === 'sustain') return;
    const channel = this.remembered.channel;
    if (channel !== 'all' && msg.channel !== channel) return;
    if (msg.kind === 'breath') {
      for (const fn of this.breathListeners) fn(msg.value, e.timestamp);
      return;
    }
    this.emit({
      type: msg.kind === 'note-on' ? 'on' : 'off',
      midi: msg.midi,
      velocity: msg.kind === 'note-on' ? msg.velocity : 0,
      timeStamp: e.timestamp,
      source: 'midi',
      deviceId: e.target?.id ?? this.selected?.id ?? null,
    });
  }

  private emit(e: NoteEvent) {
    for (const fn of this.noteListeners) fn(e);
  }

  /** Follows hot-plug: keeps the chosen device while it is there, picks the remembered one back up. */
  private refreshDevices(autoSelect = true) {
    const devices: MidiDevice[] = WebMidi.inputs.map((i) => ({ id: i.id, name: i.name, manufacturer: i.manufacturer }));
    let message = '';
    let lost = false;
    if (this.selected && !devices.some((d) => d.id === this.selected?.id)) {
      message = `${this.selected.name} was disconnected. Plug it back in, or choose another input.`;
      this.detach();
      lost = true;
    }
    // After a disconnection, wait for that device rather than switch silently to another one.
    if (autoSelect && !lost && !this.selected && devices.length > 0) {
      const wanted =
        devices.find((d) => d.name === this.remembered.deviceName) ??
        (this.remembered.deviceName ? undefined : devices[0]);
      if (wanted) {
        const input = WebMidi.getInputById(wanted.id);
        if (input) {
          this.selected = input;
          input.addListener('midimessage', this.onMidiMessage as never);
          message = `Listening to ${input.name}.`;
          this.remember({ deviceName: input.name });
        }
      }
    }
    if (!message) {
      message = this.selected
        ? `Listening to ${this.selected.name}.`
        : devices.length === 0
          ? 'No MIDI device is connected. Plug one in, or play with the on-screen or computer keyboard.'
          : 'Choose a MIDI input.';
    }
    this.setStatus({ state: 'ready', devices, selected: this.selected?.id ?? null, message });
  }

  private remember(patch: Partial<Remembered>) {
    this.remembered = { ...this.remembered, ...patch };
    try {
      localStorage.setItem(STORAGE_KEY, JSON.stringify(this.remembered));
    } catch {}
  }

  private setStatus(s: InputStatus): InputStatus {
    this.status = s;
    this.emitStatus();
    return s;
  }

  private emitStatus() {
    for (const fn of this.statusListeners) fn(this.status);
  }
}
