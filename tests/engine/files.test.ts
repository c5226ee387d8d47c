import { type MidiData, parseMidi, writeMidi } from 'midi-file';
import MidiWriter from 'midi-writer-js';
import { describe, expect, it } from 'vitest';
import {
  type Drill,
  EngineError,
  drillToMidi,
  generateDrill,
  instruments,
  MAX_FILE_NOTES,
  midiToPlayed,
} from '../../shared/engine';
import { countNoteOns } from '../../shared/engine/files/note-ons';
import { MAX_PLAYED_NOTES } from '../../shared/schemas/takes';

/** Notes of a parsed file, as [absolute tick, key, velocity] of note-ons with velocity > 0. */
function noteOns(track: MidiData['tracks'][number]): { tick: number; key: number }[] {
  let tick = 0;
  const out: { tick: number; key: number }[] = [];
  for (const e of track) {
    tick += e.deltaTime;
    if (e.type === 'noteOn' && e.velocity > 0) out.push({ tick, key: e.noteNumber });
  }
  return out;
}

const weave = () => generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up', start: 65, tempo: 96 });
const fourThree = () =>
  generateDrill({
    pair: ['F', 'B'],
    pattern: 'four-three',
    direction: 'up-down',
    start: 57,
    tempo: 150,
    meter: [7, 8],
  });

describe('drillToMidi, read back by midi-file', () => {
  it.each([
    ['weave at 96', weave],
    ['four-three in 7/8 at 150', fourThree],
  ])('%s: tempo, meter, note count and pitches', (_label, make) => {
    const drill: Drill = make();
    const file = parseMidi(drillToMidi(drill));
    const events = file.tracks.flat();
    const tempo = events.find((e) => e.type === 'setTempo');
    // Standard MIDI Files 1.0: set-tempo holds microseconds per quarter note = 60,000,000 / bpm
    expect(tempo && 'microsecondsPerBeat' in tempo ? tempo.microsecondsPerBeat : null).toBe(
      Math.round(60_000_000 / drill.spec.tempo),
    );
    const meter = events.find((e) => e.type === 'timeSignature');
    // Standard MIDI Files 1.0: time signature numerator and denominator (as written back by the parser)
    expect(meter && 'numerator' in meter ? [meter.numerator, meter.denominator] : null).toEqual(drill.spec.meter);
    const drillTrack = file.tracks.find((t) => t.some((e) => e.type === 'trackName' && e.text === 'Drill'))!;
    const ons = noteOns(drillTrack);
    expect(ons.map((n) => n.key)).toEqual(drill.notes.map((n) => n.midi)); // MIDI 1.0 note numbers
    const ppq = file.header.ticksPerBeat!;
    expect(ons.map((n) => n.tick / ppq)).toEqual(drill.notes.map((n) => Math.round(n.beat * ppq) / ppq));
  });

  it("writes the instrument's General MIDI program on the Drill track", () => {
    const drill = generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up', instrument: 'flute' });
    const events = parseMidi(drillToMidi(drill)).tracks.flat();
    const program = events.find((e) => e.type === 'programChange');
    expect(program && 'programNumber' in program ? program.programNumber : null).toBe(instruments.flute.program);
  });

  it('reads its own files back through midiToPlayed', () => {
    const drill = weave();
    const played = midiToPlayed(drillToMidi(drill));
    expect(played.map((p) => p.midi)).toEqual(drill.notes.map((n) => n.midi));
    const msPerBeat = 60_000 / drill.spec.tempo;
    played.forEach((p, i) => {
      expect(p.timeMs).toBeCloseTo(drill.notes[i].beat * msPerBeat, 0);
      expect(p.durationMs).toBeCloseTo(drill.notes[i].duration * msPerBeat, 0);
    });
  });
});

describe('midiToPlayed on files written by midi-file', () => {
  const file = (tracks: MidiData['tracks'], ticksPerBeat = 96): Uint8Array =>
    Uint8Array.from(writeMidi({ header: { format: 1, numTracks: tracks.length, ticksPerBeat }, tracks }));
  const end = { deltaTime: 0, meta: true, type: 'endOfTrack' } as const;
  const on = (deltaTime: number, noteNumber: number, velocity = 100) =>
    ({ deltaTime, channel: 0, type: 'noteOn', noteNumber, velocity }) as const;
  const off = (deltaTime: number, noteNumber: number) =>
    ({ deltaTime, channel: 0, type: 'noteOff', noteNumber, velocity: 0 }) as const;

  it('follows the tempo map (Standard MIDI Files 1.0: set-tempo in microseconds per quarter)', () => {
    const bytes = file([
      [
        { deltaTime: 0, meta: true, type: 'setTempo', microsecondsPerBeat: 500_000 },
        { deltaTime: 192, meta: true, type: 'setTempo', microsecondsPerBeat: 1_000_000 },
        end,
      ],
      [on(0, 60), off(96, 60), on(96, 62), off(96, 62), on(0, 64, 0), on(96, 64, 70), off(48, 64), end],
    ]);
    const played = midiToPlayed(bytes);
    // 120 bpm for two quarters (500 ms each), then 60 bpm: a quarter lasts 1000 ms
    expect(played).toEqual([
      { midi: 60, timeMs: 0, velocity: 100, durationMs: 500 },
      { midi: 62, timeMs: 1000, velocity: 100, durationMs: 1000 },
      { midi: 64, timeMs: 3000, velocity: 70, durationMs: 500 },
    ]);
  });

  it('reads the "Take" track when there is one', () => {
    const bytes = file([
      [{ deltaTime: 0, meta: true, type: 'trackName', text: 'Drill' }, on(0, 60), off(96, 60), end],
      [{ deltaTime: 0, meta: true, type: 'trackName', text: 'Take' }, on(10, 61), off(90, 61), end],
    ]);
    expect(midiToPlayed(bytes).map((p) => p.midi)).toEqual([61]);
  });

  it('reads every channel of the "Take" track, and 120 bpm until the first set tempo', () => {
    const bytes = file([
      [{ deltaTime: 96, meta: true, type: 'setTempo', microsecondsPerBeat: 1_000_000 }, end],
      [
        { deltaTime: 0, meta: true, type: 'trackName', text: 'Take' },
        on(0, 60),
        { ...on(0, 67), channel: 3 },
        off(96, 60),
        { ...off(0, 67), channel: 3 },
        on(0, 64),
        off(96, 64),
        end,
      ],
    ]);
    // a quarter at 120 bpm (500 ms), then 60 bpm
    expect(midiToPlayed(bytes).map((p) => [p.midi, p.timeMs])).toEqual([
      [60, 0],
      [67, 0],
      [64, 500],
    ]);
  });

  it('skips a chunk of another type (Standard MIDI Files 1.0)', () => {
    const whole = drillToMidi(weave());
    const alien = Uint8Array.from([
      ...whole.subarray(0, 14),
      0x4d,
      0x54,
      0x78,
      0x78,
      0,
      0,
      0,
      2,
      1,
      2,
      ...whole.subarray(14),
    ]);
    expect(midiToPlayed(alien)).toEqual(midiToPlayed(whole));
  });

  it('merges every track in time order when there is no Take track', () => {
    const bytes = file([
      [on(48, 60), off(48, 60), end],
      [on(0, 72), off(96, 72), end],
    ]);
    expect(midiToPlayed(bytes).map((p) => p.midi)).toEqual([72, 60]);
  });

  it.each([
    ['an empty file', new Uint8Array(0)],
    ['text', new TextEncoder().encode('hello, this is not MIDI at all')],
    ['a cut header', Uint8Array.from([0x4d, 0x54, 0x68, 0x64, 0, 0, 0, 6, 0])],
  ])('refuses %s with an EngineError', (_label, bytes) => {
    expect(() => midiToPlayed(bytes)).toThrow(EngineError);
  });

  it('refuses a file cut short, or one without notes, with an EngineError (never a TypeError)', () => {
    const whole = drillToMidi(weave());
    for (let cut = 1; cut < whole.length; cut += 7) {
      let thrown: unknown = null;
      try {
        midiToPlayed(whole.slice(0, cut));
      } catch (err) {
        thrown = err;
      }
      expect(thrown).toBeInstanceOf(EngineError);
    }
    expect(() =>
      midiToPlayed(file([[{ deltaTime: 0, meta: true, type: 'setTempo', microsecondsPerBeat: 500_000 }, end]])),
    ).toThrow(/no notes/);
    const garbled = whole.slice();
    for (let i = 30; i < garbled.length; i += 5) garbled[i] = 0xf5;
    expect(() => midiToPlayed(garbled)).toThrow(EngineError);
    expect(() => midiToPlayed(null as unknown as Uint8Array)).toThrow(EngineError);
  });
});

describe('midiToPlayed counts the notes before reading a file', () => {
  /** A format 1 file, 96 ticks a quarter, of these track chunks (each the events after the chunk's length). */
  const smf = (...chunks: Uint8Array[]): Uint8Array => {
    const out = new Uint8Array(14 + chunks.reduce((n, c) => n + 8 + c.length, 0));
    out.set([0x4d, 0x54, 0x68, 0x64, 0, 0, 0, 6, 0, 1, 0, chunks.length, 0, 96]);
    let at = 14;
    for (const c of chunks) {
      out.set(
        [0x4d, 0x54, 0x72, 0x6b, c.length >>> 24, (c.length >> 16) & 255, (c.length >> 8) & 255, c.length & 255],
        at,
      );
      out.set(c, at + 8);
      at += 8 + c.length;
    }
    return out;
  };
  /** `n` eighth notes one after another, written by midi-writer-js (4,000 a track: its writer overflows the stack on one long track). */
  const writtenElsewhere = (n: number): Uint8Array => {
    const tracks = [];
    for (let first = 0; first < n; first += 4000) {
      const track = new MidiWriter.Track();
      for (let i = first; i < Math.min(n, first + 4000); i++) {
        track.addEvent(new MidiWriter.NoteEvent({ pitch: [60 + (i % 12)], duration: 'T8', velocity: 80 }));
      }
      tracks.push(track);
    }
    return new MidiWriter.Writer(tracks).buildFile();
  };
  /** `n` notes in running status: one 90 status byte, then (delta, key, velocity) for each on and off (velocity 0). */
  const running = (n: number): Uint8Array => {
    const events = new Uint8Array(1 + n * 6 + 4);
    events.set([0, 0x90, 60, 100]);
    for (let i = 0; i < n; i++) events.set(i === 0 ? [24, 60, 0] : [0, 60, 100, 24, 60, 0], i === 0 ? 4 : 1 + i * 6);
    events.set([0, 0xff, 0x2f, 0], events.length - 4);
    return events;
  };
  const tooMany = /more than 20,000 notes; a take holds at most 20,000/;

  it('holds the same limit as a take', () => {
    expect(MAX_FILE_NOTES).toBe(20_000);
    expect(MAX_PLAYED_NOTES).toBe(MAX_FILE_NOTES);
  });

  it('refuses 20,001 notes written by midi-writer-js with an EngineError naming the limit, quickly', () => {
    const bytes = writtenElsewhere(20_001);
    expect(parseMidi(bytes).tracks.flatMap(noteOns)).toHaveLength(20_001);
    const started = performance.now();
    expect(() => midiToPlayed(bytes)).toThrow(EngineError);
    expect(() => midiToPlayed(bytes)).toThrow(tooMany);
    expect(performance.now() - started).toBeLessThan(500);
  });

  it('still reads a file of exactly 20,000 notes', () => {
    const played = midiToPlayed(writtenElsewhere(20_000));
    expect(played).toHaveLength(20_000);
    expect(played[19_999].midi).toBe(60 + (19_999 % 12));
  });

  it('counts note-ons in running status, and not those of velocity 0', () => {
    expect(parseMidi(smf(running(20_000))).tracks.flatMap(noteOns)).toHaveLength(20_000);
    expect(midiToPlayed(smf(running(20_000)))).toHaveLength(20_000);
    expect(() => midiToPlayed(smf(running(20_001)))).toThrow(tooMany);
    expect(() => midiToPlayed(smf(running(10_000), running(10_001)))).toThrow(tooMany);
  });

  it('steps over every kind of event by its own length', () => {
    const events = Uint8Array.from([
      0x00,
      0x90,
      60,
      100, // note-on
      0x10,
      62,
      100, // running status: note-on
      0x10,
      60,
      0, // running status, velocity 0: a note-off
      0x00,
      0xc2,
      5,
      0x00,
      7, // program change and a running one, channel 3: one data byte each
      0x00,
      0xd2,
      0x40, // channel pressure: one data byte
      0x00,
      0xb0,
      7,
      100,
      0x00,
      0xe0,
      0,
      0x40,
      0x00,
      0xa0,
      62,
      32, // control change, pitch bend, key pressure: two
      0x00,
      0xf0,
      3,
      0x7e,
      0x7f,
      0xf7, // sysex
      0x00,
      0xff,
      0x01,
      3,
      0x90,
      64,
      100, // a text event whose text looks like a note-on
      0x00,
      0xf7,
      2,
      0x91,
      0x40, // an escape
      0x00,
      0x91,
      64,
      90, // note-on, channel 2
      0x81,
      0x00,
      67,
      90, // running status after a two-byte delta time: note-on
      0x10,
      0x80,
      62,
      0,
      0x00,
      0x81,
      64,
      0,
      0x00,
      67,
      0, // note-offs, the last in running status
      0x00,
      0xff,
      0x2f,
      0x00,
    ]);
    expect(countNoteOns(events)).toEqual({ noteOns: 4, overlong: false });
    expect(parseMidi(smf(events)).tracks.flatMap(noteOns)).toHaveLength(4); // midi-file agrees
    expect(midiToPlayed(smf(events)).map((n) => n.midi)).toEqual([60, 62, 64, 67]);
    // cut anywhere, or garbled, the count stops where the events stop making sense, and never throws
    for (let cut = 0; cut <= events.length; cut++)
      expect(countNoteOns(events.subarray(0, cut)).noteOns).toBeLessThanOrEqual(4);
    let seed = 7;
    for (let round = 0; round < 200; round++) {
      const noise = events.map((b) => {
        seed = (seed * 1_103_515_245 + 12_345) % 2 ** 31;
        return seed % 5 === 0 ? seed % 256 : b;
      });
      expect(() => countNoteOns(noise)).not.toThrow();
      expect(() => midiToPlayed(smf(noise))).not.toThrow(TypeError);
    }
  });

  it('refuses a dense 1 MB file (120,000 notes) in milliseconds', () => {
    const events = new Uint8Array(120_000 * 8 + 4);
    for (let i = 0; i < 120_000; i++) events.set([0, 0x90, 60 + (i % 24), 100, 1, 0x80, 60 + (i % 24), 0], i * 8);
    events.set([0, 0xff, 0x2f, 0], events.length - 4);
    const bytes = smf(events);
    expect(bytes.length).toBeLessThanOrEqual(1024 * 1024);
    const started = performance.now();
    expect(() => midiToPlayed(bytes)).toThrow(tooMany);
    expect(performance.now() - started).toBeLessThan(500);
  });

  it('refuses a length longer than four bytes, which sends the package back over the same bytes for ever', () => {
    // 8F FF FF FF 78 adds up to -8 in the package's 32 bits: the text event would be read again and again
    const events = Uint8Array.from([
      0x00, 0xff, 0x01, 0x8f, 0xff, 0xff, 0xff, 0x78, 0x00, 0x90, 60, 100, 0x60, 60, 0, 0x00, 0xff, 0x2f, 0x00,
    ]);
    expect(countNoteOns(events).overlong).toBe(true);
    expect(() => midiToPlayed(smf(events))).toThrow(/could not be read/);
  });
});

// drillToMusicXml is tested in musicxml.test.ts: it is now drawn from notate(drill).
