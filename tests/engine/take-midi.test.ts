import { type MidiEvent, parseMidi } from 'midi-file';
import { describe, expect, it } from 'vitest';
import { type Drill, type DrillNote, type PlayedNote, takeToMidi } from '../../shared/engine';

function note(midi: number, name: string, beat: number, cell: number, source: 'a' | 'b'): DrillNote {
  return { midi, name, written: name, beat, duration: 0.5, measure: 1, beatInMeasure: beat + 1, source, cell };
}

// F major then Eb major, in eighths at 90 bpm: one cell each of a `weave`-like drill
const drill: Drill = {
  spec: {
    pair: ['F', 'Eb'],
    pattern: 'weave',
    direction: 'up',
    range: { low: 21, high: 108 },
    start: 65,
    instrument: 'piano',
    tempo: 90,
    meter: [3, 4],
  },
  notes: [
    note(65, 'F4', 0, 0, 'a'),
    note(69, 'A4', 0.5, 0, 'a'),
    note(72, 'C5', 1, 0, 'a'),
    note(75, 'Eb5', 1.5, 1, 'b'),
    note(70, 'Bb4', 2, 1, 'b'),
    note(67, 'G4', 2.5, 1, 'b'),
  ],
  measures: 1,
};
const beatMs = 60000 / 90;

const played: PlayedNote[] = [
  { midi: 65, timeMs: -20, velocity: 70, durationMs: 300 }, // before the first downbeat
  { midi: 69, timeMs: beatMs * 0.5 + 10, velocity: 90, durationMs: 400 }, // legato: held into the next
  { midi: 72, timeMs: beatMs, velocity: 100, durationMs: 200 },
  { midi: 72, timeMs: beatMs + 20, velocity: 40 }, // a key bounce, no length recorded
  { midi: 75, timeMs: beatMs * 1.5, velocity: 127, durationMs: 150 },
];

interface ReadNote {
  tick: number;
  midi: number;
  velocity: number;
  channel: number;
}

function notesOf(track: MidiEvent[]): { name: string | null; notes: ReadNote[]; offs: number } {
  let tick = 0;
  let name: string | null = null;
  const notes: ReadNote[] = [];
  let offs = 0;
  for (const e of track) {
    tick += e.deltaTime;
    if (e.type === 'trackName') name = e.text;
    // MIDI 1.0: a note-on with velocity 0 counts as a note-off
    if (e.type === 'noteOn' && e.velocity > 0)
      notes.push({ tick, midi: e.noteNumber, velocity: e.velocity, channel: e.channel });
    else if (e.type === 'noteOff' || e.type === 'noteOn') offs++;
  }
  return { name, notes, offs };
}

describe('takeToMidi, read back by midi-file', () => {
  const parsed = parseMidi(takeToMidi({ drill, played }));
  const ppq = parsed.header.ticksPerBeat ?? 0;
  const tracks = parsed.tracks.map(notesOf);
  const drillTrack = tracks.find((t) => t.name === 'Drill');
  const takeTrack = tracks.find((t) => t.name === 'Take');

  it('is a format 1 file with named "Drill" and "Take" tracks', () => {
    expect(parsed.header.format).toBe(1);
    expect(ppq).toBeGreaterThan(0);
    expect(drillTrack).toBeDefined();
    expect(takeTrack).toBeDefined();
  });

  it("carries the drill's tempo and meter", () => {
    const events = parsed.tracks.flat();
    const tempo = events.find((e) => e.type === 'setTempo');
    const meter = events.find((e) => e.type === 'timeSignature');
    // MIDI 1.0 (Standard MIDI Files): tempo is microseconds per quarter note
    expect(tempo && tempo.type === 'setTempo' ? tempo.microsecondsPerBeat : 0).toBe(Math.round(60_000_000 / 90));
    expect(meter && meter.type === 'timeSignature' ? [meter.numerator, meter.denominator] : []).toEqual([3, 4]);
  });

  it('holds every drill note on its beat, time 0 the first downbeat', () => {
    expect(drillTrack?.notes.map((n) => [n.tick / ppq, n.midi])).toEqual(drill.notes.map((n) => [n.beat, n.midi]));
    expect(drillTrack?.offs).toBe(drill.notes.length);
  });

  it('holds every played note at its real time and velocity, an early one at 0', () => {
    const toTick = (ms: number) => Math.round(((Math.max(0, ms) * 90) / 60000) * ppq);
    expect(takeTrack?.notes.map((n) => [n.tick, n.midi, n.velocity])).toEqual(
      played.map((p) => [toTick(p.timeMs), p.midi, p.velocity]),
    );
    expect(takeTrack?.offs).toBe(played.length);
  });

  it('keeps a bounced key as two notes, the first cut where the second begins', () => {
    let tick = 0;
    const c5: Array<[string, number]> = [];
    const take = parsed.tracks[tracks.indexOf(takeTrack ?? tracks[0])];
    for (const e of take) {
      tick += e.deltaTime;
      if ((e.type === 'noteOn' || e.type === 'noteOff') && e.noteNumber === 72) c5.push([e.type, tick]);
    }
    const bounce = Math.round(((beatMs + 20) * 90 * ppq) / 60000);
    expect(c5.map(([t]) => t)).toEqual(['noteOn', 'noteOff', 'noteOn', 'noteOff']);
    expect(c5[1][1]).toBe(bounce);
    expect(c5[2][1]).toBe(bounce);
  });

  it('writes a take with no notes as two named tracks all the same', () => {
    const empty = parseMidi(takeToMidi({ drill, played: [] })).tracks.map(notesOf);
    expect(empty.find((t) => t.name === 'Take')?.notes).toEqual([]);
    expect(empty.find((t) => t.name === 'Drill')?.notes.length).toBe(drill.notes.length);
  });
});
