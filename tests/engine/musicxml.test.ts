import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { XMLParser } from 'fast-xml-parser';
import { Note } from 'tonal';
import { afterAll, describe, expect, it } from 'vitest';
import {
  type Drill,
  type DrillSpec,
  drillToMusicXml,
  generateDrill,
  instruments,
  notate,
  sliceDrill,
} from '../../shared/engine';

// A general XML reader, not the project's own code, reads every file back.
const ARRAYS = new Set(['measure', 'note', 'beam', 'clef', 'direction', 'harmony', 'tuplet', 'direction-type']);
const parser = new XMLParser({ ignoreAttributes: false, isArray: (name) => ARRAYS.has(name) });

type Attr = Record<string, string>;
interface XmlNote {
  pitch?: { step: string; alter?: number; octave: number };
  rest?: unknown;
  duration: number;
  staff?: number;
  type?: string;
  dot?: unknown;
  accidental?: string;
  stem?: string;
  beam?: ({ '#text': string } & Attr)[];
  'time-modification'?: { 'actual-notes': number; 'normal-notes': number };
  notations?: { tuplet?: Attr[] };
}
interface XmlMeasure {
  '@_number': string;
  note?: XmlNote[];
  attributes?: Record<string, unknown>;
  direction?: { 'direction-type': Record<string, unknown>[]; sound?: Attr }[];
  harmony?: { root: { 'root-step': string; 'root-alter'?: number }; kind: { '#text': string } & Attr }[];
  barline?: { 'bar-style': string } & Attr;
  backup?: { duration: number };
}

function read(xml: string) {
  const doc = parser.parse(xml);
  const score = doc['score-partwise'];
  const measures: XmlMeasure[] = score.part.measure;
  const notes = measures.flatMap((m) => m.note ?? []);
  return { score, measures, notes, pitched: notes.filter((n) => n.pitch) };
}

const midiOf = (p: NonNullable<XmlNote['pitch']>) =>
  (Number(p.octave) + 1) * 12 + (Note.chroma(p.step) ?? 0) + Number(p.alter ?? 0);

/** A piano drill whose top notes, B7 and C8, need a two-octave line. */
const PIANO_TO_C8: DrillSpec = {
  pair: ['F', 'Eb'],
  pattern: 'weave',
  direction: 'up-down',
  instrument: 'piano',
  range: { low: 72, high: 108 },
};

// fast-xml-parser's document-order form: each node is { tag: children, ':@': attributes }
type OrderedNode = Record<string, unknown>;
const childrenOf = (nodes: OrderedNode[], tag: string): OrderedNode[] =>
  nodes.filter((n) => tag in n).flatMap((n) => n[tag] as OrderedNode[]);
const attrsOf = (node: OrderedNode): Attr =>
  Object.fromEntries(Object.entries((node[':@'] ?? {}) as Attr).map(([k, v]) => [k.replace(/^@_/, ''), String(v)]));
const textOf = (nodes: OrderedNode[], tag: string): string | undefined => {
  const text = childrenOf(nodes, tag).find((n) => '#text' in n)?.['#text'];
  return text === undefined ? undefined : String(text);
};

const SPECS: [string, DrillSpec][] = [
  ['piano, weave up-down, default range', { pair: ['F', 'Eb'], pattern: 'weave', direction: 'up-down' }],
  [
    'piano over its whole compass',
    { pair: ['F', 'Eb'], pattern: 'stack', direction: 'up', range: { low: 21, high: 108 } },
  ],
  ['alto sax in 6/8', { pair: ['B', 'A'], pattern: 'weave', direction: 'up', meter: [6, 8], instrument: 'alto-sax' }],
  [
    'trombone in 7/8',
    { pair: ['F', 'B'], pattern: 'four-three', direction: 'up', meter: [7, 8], instrument: 'trombone' },
  ],
  ['guitar in 3/4', { pair: ['F', 'B'], pattern: 'scale-steps', direction: 'up', meter: [3, 4], instrument: 'guitar' }],
  [
    'trumpet in 5/4',
    { pair: ['F#', 'E'], pattern: 'leap-back', direction: 'down', instrument: 'trumpet', meter: [5, 4] },
  ],
  [
    'wind controller in sixteenths',
    {
      pair: ['Fm', 'Eb'],
      pattern: { name: 'threes', subdivision: 'sixteenth', source: 'scale', degrees: [0, 1, 2], step: 1 },
      direction: 'up',
      instrument: 'wind-controller',
      range: { low: 36, high: 96 },
    },
  ],
  [
    'tenor sax in 12/8',
    { pair: ['Db', 'Eb'], pattern: 'stack', direction: 'up-down', meter: [12, 8], instrument: 'tenor-sax' },
  ],
];

describe('drillToMusicXml, read back by fast-xml-parser', () => {
  it.each(SPECS)('%s: written pitch, same staves and clefs as notate, bars filled', (_label, spec) => {
    const drill = generateDrill(spec);
    const notation = notate(drill);
    const inst = instruments[drill.spec.instrument];
    const { score, measures, pitched } = read(drillToMusicXml(drill));
    expect(score['@_version']).toBe('4.0'); // MusicXML 4.0: partwise score
    expect(measures.map((m) => Number(m['@_number']))).toEqual(notation.measures.map((m) => m.number));
    // MusicXML 4.0: <pitch> is written pitch for a transposing part; written = concert - transposition
    expect(pitched.map((n) => midiOf(n.pitch!))).toEqual(
      notation.measures.flatMap((m) =>
        [...m.events]
          .sort((x, y) => x.staff - y.staff || x.start - y.start)
          .filter((e) => e.kind === 'note')
          .map((e) => drill.notes[e.noteIndex!].midi - inst.transposition),
      ),
    );
    // the same printed accidentals as the model, in the same order
    expect(pitched.map((n) => n.accidental ?? null)).toEqual(
      notation.measures.flatMap((m) =>
        [...m.events]
          .sort((x, y) => x.staff - y.staff || x.start - y.start)
          .filter((e) => e.kind === 'note')
          .map((e) => (e.accidental ? { '#': 'sharp', b: 'flat', n: 'natural' }[e.accidental] : null)),
      ),
    );
    // MusicXML 4.0: <clef> sign G for treble, F for bass; clef-octave-change -1 for treble-8vb
    const attrs = measures[0].attributes as { divisions: number; clef: Record<string, unknown>[]; staves?: number };
    const signs = attrs.clef.map((c) => `${c.sign}${c['clef-octave-change'] ?? ''}`);
    const expected = notation.staves.map((c) => (c === 'bass' ? 'F' : c === 'treble-8vb' ? 'G-1' : 'G'));
    expect(signs).toEqual(expected);
    if (notation.staves.length === 2) expect(Number(attrs.staves)).toBe(2);
    // every staff of every bar adds up to the meter (MusicXML 4.0: <duration> in divisions per quarter)
    const [num, den] = drill.spec.meter;
    const bar = (Number(attrs.divisions) * 4 * num) / den;
    for (const m of measures) {
      for (let s = 1; s <= notation.staves.length; s++) {
        const onStaff = (m.note ?? []).filter((n) => Number(n.staff ?? 1) === s);
        expect(onStaff.reduce((t, n) => t + Number(n.duration), 0)).toBe(bar);
      }
    }
    // a final light-heavy barline (MusicXML 4.0 bar-style)
    const lastBar = measures[measures.length - 1].barline;
    expect(lastBar?.['bar-style']).toBe('light-heavy');
    expect(lastBar?.['@_location']).toBe('right');
    // the part names its instrument and its MIDI program (MusicXML 4.0: midi-program is 1-based)
    const part = score['part-list']['score-part'];
    expect(part['part-name']).toBe(inst.label);
    expect(part['score-instrument']['instrument-name']).toBe(inst.label);
    expect(part['midi-instrument']['@_id']).toBe(part['score-instrument']['@_id']);
    expect(Number(part['midi-instrument']['midi-program'])).toBe(inst.program + 1);
  });

  it('writes a <beam> for every beam group of the model, begin to end', () => {
    const drill = generateDrill({ pair: ['F', 'Eb'], pattern: 'weave-four', direction: 'up', start: 53 });
    const groups = notate(drill).measures.reduce(
      (t, m) => t + new Set(m.events.filter((e) => e.beam !== undefined).map((e) => `${e.staff}:${e.beam}`)).size,
      0,
    );
    const { notes } = read(drillToMusicXml(drill));
    const beams = notes.flatMap((n) => (n.beam ?? []).filter((b) => b['@_number'] === '1').map((b) => b['#text']));
    expect(beams.filter((b) => b === 'begin')).toHaveLength(groups);
    expect(beams.filter((b) => b === 'end')).toHaveLength(groups);
    expect(groups).toBeGreaterThan(0);
  });

  it('brackets each triplet with a "3" besides its time-modification', () => {
    const drill = generateDrill({
      pair: ['F', 'Eb'],
      pattern: 'weave',
      direction: 'up',
      start: 65,
      range: { low: 60, high: 76 },
    });
    const { notes } = read(drillToMusicXml(drill));
    const tuplets = notes.flatMap((n) => n.notations?.tuplet ?? []);
    const starts = tuplets.filter((t) => t['@_type'] === 'start');
    expect(starts.length).toBeGreaterThan(0);
    expect(tuplets.filter((t) => t['@_type'] === 'stop')).toHaveLength(starts.length);
    // MusicXML 4.0: bracket="yes" and show-number="actual" print the bracket and the 3
    for (const t of starts) expect([t['@_bracket'], t['@_show-number']]).toEqual(['yes', 'actual']);
    for (const n of notes.filter((x) => x.pitch)) {
      expect(n['time-modification']).toEqual({ 'actual-notes': 3, 'normal-notes': 2 });
      expect(n.type).toBe('eighth');
    }
  });

  it('writes a triplet pattern in 6/8 as plain eighths, with a dotted-quarter metronome', () => {
    const drill = generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up', meter: [6, 8], tempo: 80 });
    const { measures, notes } = read(drillToMusicXml(drill));
    expect(notes.some((n) => n['time-modification'])).toBe(false);
    const metronome = measures[0].direction?.flatMap((d) => d['direction-type']).find((t) => t.metronome)
      ?.metronome as Record<string, unknown>;
    // MusicXML 4.0: <beat-unit>quarter</beat-unit><beat-unit-dot/> is a dotted quarter
    expect(metronome['beat-unit']).toBe('quarter');
    expect(metronome).toHaveProperty('beat-unit-dot');
    expect(Number(metronome['per-minute'])).toBe(80);
    // <sound tempo> counts quarter notes: 80 dotted quarters are 120 quarters
    const sound = measures[0].direction?.find((d) => d.sound)?.sound;
    expect(Number(sound?.['@_tempo'])).toBe(120);
  });

  it('marks ottava passages with balanced <octave-shift> starts and stops', () => {
    const drill = generateDrill({
      pair: ['F', 'Eb'],
      pattern: 'stack',
      direction: 'up',
      range: { low: 21, high: 108 },
    });
    const { measures } = read(drillToMusicXml(drill));
    const shifts = measures
      .flatMap((m) => m.direction ?? [])
      .flatMap((d) => d['direction-type'])
      .map((t) => t['octave-shift'] as Attr | undefined)
      .filter((x): x is Attr => !!x);
    const types = shifts.map((s) => s['@_type']);
    // MusicXML 4.0: type "down" starts an 8va line, "up" an 8vb line
    expect(types).toContain('down');
    expect(types).toContain('up');
    expect(types.filter((t) => t === 'stop')).toHaveLength(types.filter((t) => t !== 'stop').length);
  });

  it('marks the top of a piano drill reaching C8 with a two-octave <octave-shift> and prints it two octaves down', () => {
    const drill = generateDrill(PIANO_TO_C8);
    expect(Math.max(...drill.notes.map((n) => n.midi))).toBe(108);
    const xml = drillToMusicXml(drill);
    // read in document order, so each note is seen under the octave shift that precedes it
    const ordered = new XMLParser({ ignoreAttributes: false, preserveOrder: true }).parse(xml) as OrderedNode[];
    const measures = childrenOf(childrenOf(childrenOf(ordered, 'score-partwise'), 'part'), 'measure');
    const active = new Map<string, { type: string; size: number }>();
    const shifts: Attr[] = [];
    let underTwo = 0;
    for (const node of measures) {
      if ('direction' in node) {
        const shift = childrenOf(childrenOf([node], 'direction'), 'direction-type').find((t) => 'octave-shift' in t);
        if (!shift) continue;
        const attrs = attrsOf(shift);
        shifts.push(attrs);
        if (attrs.type === 'stop') active.delete(attrs.number);
        else active.set(attrs.number, { type: attrs.type, size: Number(attrs.size) });
      }
      if ('note' in node) {
        const note = childrenOf([node], 'note');
        const pitch = childrenOf(note, 'pitch');
        if (pitch.length === 0) continue;
        const staff = Number(textOf(note, 'staff') ?? 1);
        const step = textOf(pitch, 'step')!;
        const octave = Number(textOf(pitch, 'octave'));
        // MusicXML 4.0: <pitch> is the note as written; an octave-shift of type "down" and size 8
        // or 15 shows it one or two octaves below, "up" above
        const shift = active.get(String(staff));
        const octaves = shift ? (shift.size === 15 ? 2 : 1) * (shift.type === 'down' ? 1 : -1) : 0;
        const shown = (octave - octaves) * 7 + 'CDEFGAB'.indexOf(step);
        if (shift?.size === 15) {
          underTwo++;
          expect(shift.type).toBe('down');
        }
        // common practice: no note more than four ledger lines off its staff, as printed
        // (treble lines E4 to F5, bass G2 to A3)
        const [bottom, top] = staff === 1 ? [30, 38] : [18, 26];
        const lines =
          shown > top ? Math.floor((shown - top) / 2) : shown < bottom ? Math.floor((bottom - shown) / 2) : 0;
        expect(lines, `${step}${octave}`).toBeLessThanOrEqual(4);
      }
    }
    expect(underTwo).toBeGreaterThan(0);
    // MusicXML 4.0: size 15 for a two-octave line, its stop with the same size
    expect(shifts.some((x) => x.size === '15' && x.type === 'down')).toBe(true);
    expect(shifts.filter((x) => x.size === '15' && x.type === 'stop')).toHaveLength(
      shifts.filter((x) => x.size === '15' && x.type !== 'stop').length,
    );
    // the model agrees: the notes under the two-octave line are its 15ma notes
    const fifteen = notate(drill).measures.flatMap((m) => m.events.filter((e) => e.kind === 'note' && e.ottava === 15));
    expect(fifteen).toHaveLength(underTwo);
  });

  it("keeps a slice's measure numbers", () => {
    const drill = generateDrill({ pair: ['F', 'B'], pattern: 'four-three', direction: 'up', start: 57 });
    const { measures } = read(drillToMusicXml(sliceDrill(drill, 2, 3)));
    expect(measures.map((m) => m['@_number'])).toEqual(['2', '3']);
  });

  it('writes chord symbols as <harmony> when the drill has changes', () => {
    // a drill as the progression generator hands it over: Drill.changes beside the notes
    const base = generateDrill({ pair: ['F', 'Eb'], pattern: 'weave', direction: 'up', start: 53 });
    const drill = {
      ...base,
      changes: [
        { chord: 'Cm7', pair: ['Eb', 'F'], startBeat: 0, beats: 4 },
        { chord: 'F7', pair: ['F', 'Eb'], startBeat: 4, beats: 2 },
        { chord: 'Bbmaj7', pair: ['Bb', 'C'], startBeat: 6, beats: 6 },
      ],
    } as Drill;
    const notation = notate(drill);
    expect(notation.measures.slice(0, 3).map((m) => m.chord)).toEqual(['Cm7', 'F7', 'Bbmaj7']);
    expect(notation.measures[1].chords).toEqual([
      { start: 0, chord: 'F7' },
      { start: 2, chord: 'Bbmaj7' },
    ]);
    const { measures } = read(drillToMusicXml(drill));
    const h = measures[1].harmony ?? [];
    // MusicXML 4.0 kind values
    expect(h.map((x) => [x.root['root-step'], x.kind['#text'], x.kind['@_text']])).toEqual([
      ['F', 'dominant', '7'],
      ['B', 'major-seventh', 'maj7'],
    ]);
    expect(Number(h[1].root['root-alter'])).toBe(-1);
    expect(measures[0].harmony?.[0].kind['#text']).toBe('minor-seventh');
  });
});

// LilyPond's musicxml2ly is an independent reader: it must take every file without a word of
// complaint. Debian ships it in the lilypond package; where it is missing the test says so.
const MUSICXML2LY = '/usr/bin/musicxml2ly';
const hasLilyPond = existsSync(MUSICXML2LY);

describe.skipIf(!hasLilyPond)('musicxml2ly (LilyPond) imports the files with no warning', () => {
  const dir = hasLilyPond ? mkdtempSync(join(tmpdir(), 'sixfold-musicxml-')) : '';
  afterAll(() => {
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  const LILY: [string, DrillSpec][] = [
    ...SPECS.slice(0, 5),
    ['piano up to C8', PIANO_TO_C8],
    [
      'alto sax over changes',
      {
        changes: [
          { chord: 'Dm7', beats: 4 },
          { chord: 'G7alt', beats: 2 },
          { chord: 'C#m7b5/G', beats: 2 },
          { chord: 'Cmaj7#11', beats: 8 },
        ],
        pattern: 'weave',
        direction: 'up',
        instrument: 'alto-sax',
      },
    ],
  ];

  it.each(LILY)('%s', (label, spec) => {
    const file = join(dir, `${label.replace(/[^a-z0-9]+/gi, '-')}.musicxml`);
    writeFileSync(file, drillToMusicXml(generateDrill(spec)));
    const out = join(dir, 'out.ly');
    const run = spawnSync(MUSICXML2LY, ['--output', out, file], { encoding: 'utf8', timeout: 60_000 });
    expect(run.status).toBe(0);
    const talk = `${run.stdout}\n${run.stderr}`;
    expect(talk).not.toMatch(/warning|error|unknown|traceback/i);
    // the engraver got the notes: LilyPond pitches and a final bar line
    const ly = readFileSync(out, 'utf8');
    expect(ly).toContain('\\bar "|."');
    // LilyPond writes a two-octave line up as \ottava #2 (its own notation for 15ma)
    if (label === 'piano up to C8') expect(ly).toContain('\\ottava #2');
  });
});

if (!hasLilyPond) {
  describe('musicxml2ly (LilyPond)', () => {
    it.skip(`is not installed at ${MUSICXML2LY} (apt-get install lilypond): the independent import check was skipped`, () => {
      execFileSync('true');
    });
  });
}
