import { XMLParser } from 'fast-xml-parser';
import { type MidiData, parseMidi, writeMidi } from 'midi-file';
import { Note } from 'tonal';
import { describe, expect, it } from 'vitest';
import {
  type Drill,
  EngineError,
  drillToMidi,
  drillToMusicXml,
  generateDrill,
  instruments,
  midiToPlayed,
  sliceDrill,
} from '../../shared/engine';

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
  generateDrill({ pair: ['F', 'B'], pattern: 'four-three', direction: 'up-down', start: 57, tempo: 150, meter: [7, 8] });

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
      [{ deltaTime: 0, meta: true, type: 'trackName', text: 'Take' }, on(0, 60), { ...on(0, 67), channel: 3 }, off(96, 60), { ...off(0, 67), channel: 3 }, on(0, 64), off(96, 64), end],
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
    const alien = Uint8Array.from([...whole.subarray(0, 14), 0x4d, 0x54, 0x78, 0x78, 0, 0, 0, 2, 1, 2, ...whole.subarray(14)]);
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
    expect(() => midiToPlayed(file([[{ deltaTime: 0, meta: true, type: 'setTempo', microsecondsPerBeat: 500_000 }, end]]))).toThrow(
      /no notes/,
    );
    const garbled = whole.slice();
    for (let i = 30; i < garbled.length; i += 5) garbled[i] = 0xf5;
    expect(() => midiToPlayed(garbled)).toThrow(EngineError);
    expect(() => midiToPlayed(null as unknown as Uint8Array)).toThrow(EngineError);
  });
});

describe('drillToMusicXml, read back by fast-xml-parser', () => {
  const parser = new XMLParser({ ignoreAttributes: false, isArray: (name) => ['measure', 'note'].includes(name) });
  type XmlNote = { pitch?: { step: string; alter?: number; octave: number }; rest?: unknown; accidental?: string; duration: number };

  function read(xml: string) {
    const doc = parser.parse(xml);
    const part = doc['score-partwise'].part;
    const measures: { note?: XmlNote[]; attributes?: Record<string, unknown>; '@_number': string }[] = part.measure;
    const notes = measures.flatMap((m) => m.note ?? []);
    return { doc, measures, notes, pitched: notes.filter((n) => n.pitch) };
  }
  const midiOf = (p: NonNullable<XmlNote['pitch']>) => (Number(p.octave) + 1) * 12 + (Note.chroma(p.step) ?? 0) + Number(p.alter ?? 0);

  it.each([
    ['piano', 0],
    ['alto-sax', -9],
    ['tenor-sax', -14],
    ['guitar', -12],
    ['trombone', 0],
  ] as const)('%s: written pitches, one per note, accidentals on altered notes', (instrument, transposition) => {
    const drill = generateDrill({ pair: ['B', 'C'], pattern: 'weave', direction: 'up-down', instrument });
    const { doc, measures, pitched } = read(drillToMusicXml(drill));
    expect(doc['score-partwise']['@_version']).toBe('4.0'); // MusicXML 4.0: partwise score
    expect(measures).toHaveLength(drill.measures);
    expect(pitched).toHaveLength(drill.notes.length);
    pitched.forEach((n, i) => {
      // MusicXML 4.0: <pitch> is written pitch for a transposing part; written = concert - transposition
      expect(midiOf(n.pitch!)).toBe(drill.notes[i].midi - transposition);
      if (Number(n.pitch!.alter ?? 0) !== 0) expect(n.accidental).toBeDefined();
    });
    // MusicXML 4.0: <clef> with sign F for bass clef, G for treble
    const clef = (measures[0].attributes as { clef: { sign: string } }).clef.sign;
    expect(clef).toBe(instrument === 'trombone' ? 'F' : 'G');
    expect(instruments[instrument].transposition).toBe(transposition);
  });

  it('fills every measure to the meter, triplets across a 7/8 bar line tied', () => {
    const drill = generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up', start: 65, meter: [7, 8] });
    const xml = drillToMusicXml(drill);
    const { doc, measures } = read(xml);
    const divisions = Number((measures[0].attributes as { divisions: number }).divisions);
    for (const m of measures) {
      const total = (m.note ?? []).reduce((s, n) => s + Number(n.duration), 0);
      expect(total).toBe((divisions * 4 * 7) / 8); // MusicXML 4.0: <duration> in divisions per quarter
    }
    expect(xml).toContain('<tie type="start"/>');
    expect(doc['score-partwise']['part-list']['score-part']['part-name']).toBe('Piano');
  });

  it('keeps a slice\'s measure numbers', () => {
    const drill = generateDrill({ pair: ['F', 'B'], pattern: 'four-three', direction: 'up', start: 57 });
    const { measures } = read(drillToMusicXml(sliceDrill(drill, 2, 3)));
    expect(measures.map((m) => m['@_number'])).toEqual(['2', '3']);
  });
});
