/**
 * Types of the engine's public contract (shared/engine/README.md).
 * Names and shapes here are a contract: outside checks call them exactly like this.
 */

export type Quality = 'major' | 'minor' | 'diminished' | 'augmented';

export interface Triad {
  symbol: string;
  root: string;
  quality: Quality;
  /** root, third, fifth */
  pitchClasses: string[];
}

export interface TriadPair {
  a: Triad;
  b: Triad;
  /** tonal interval from a's root to b's */
  interval: string;
  /** 6 pitch classes, ascending from a's root */
  hexatonic: string[];
}

export interface ChordFit {
  pair: TriadPair;
  /** tonal scale name without its tonic, rooted on the chord's root ("dorian") */
  scale: string;
  /** each hexatonic note's function against the chord, in hexatonic order */
  functions: string[];
  /** 1-based position, best first */
  rank: number;
  /** found only through a scale that leaves out the dominant's perfect fifth */
  altered: boolean;
  /** the hexatonic notes as the chord spells them (its tones) or its scale does (the rest) */
  notes: string[];
  /** what each hexatonic note is to the chord, in hexatonic order */
  roles: NoteRole[];
}

/** A chord tone, a tension (9, 11, 13 and their alterations), or another note over a triad or sus chord. */
export type NoteRole = 'chord-tone' | 'tension' | 'other';

export type PatternId =
  | 'stack'
  | 'weave'
  | 'weave-four'
  | 'leap-back'
  | 'four-three'
  | 'scale-steps'
  | 'scale-steps-triplet';

export type Subdivision = 'eighth' | 'triplet' | 'sixteenth';

export type CellEntry = 'start' | 'above' | 'below' | 'same-position' | 'next-position';

export interface TriadCellDef {
  triad: 'a' | 'b';
  notes: 3 | 4;
  shape: 'line' | 'leap';
  motion: 'up' | 'down';
  entry: CellEntry;
}

export type PatternDef =
  | { name: string; subdivision: Subdivision; source: 'triads'; cells: TriadCellDef[] }
  | {
      name: string;
      subdivision: Subdivision;
      source: 'scale';
      /** offsets from d within one cell */
      degrees: number[];
      /** d's advance per cell */
      step: number;
    };

export type Direction = 'up' | 'down' | 'up-down';

export type InstrumentId =
  | 'piano'
  | 'wind-controller'
  | 'flute'
  | 'clarinet'
  | 'soprano-sax'
  | 'alto-sax'
  | 'tenor-sax'
  | 'baritone-sax'
  | 'trumpet'
  | 'trombone'
  | 'guitar';

export interface MidiRange {
  low: number;
  high: number;
}

export interface Instrument {
  label: string;
  /** semitones written -> concert (alto sax: -9) */
  transposition: number;
  /** concert MIDI, inclusive */
  range: MidiRange;
  monophonic: boolean;
}

export type Meter = [number, number];

/** One chord of a progression: its symbol, how long it lasts, and optionally the pair pinned to it. */
export interface ChordChange {
  /** a chord symbol, e.g. 'Dm7' */
  chord: string;
  /** quarter notes */
  beats: number;
  /** pinned; else chosen among the chord's first three fits */
  pair?: [string, string];
}

/** A chord of a generated progression drill, once per chorus, with the pair it was played in. */
export interface DrillChange {
  chord: string;
  pair: [string, string];
  /** quarter notes from the first downbeat */
  startBeat: number;
  beats: number;
}

export interface DrillSpec {
  /** may be left out when `changes` is given */
  pair?: [string, string];
  pattern: PatternId | PatternDef;
  direction: Direction;
  range?: MidiRange;
  start?: number;
  instrument?: InstrumentId;
  tempo?: number;
  meter?: Meter;
  chord?: string;
  /** a progression the drill plays through, chord by chord */
  changes?: ChordChange[];
  /** times through the progression (default 1) */
  choruses?: number;
}

/** A DrillSpec with its defaults filled in, as held by a generated Drill. */
export interface FilledDrillSpec extends DrillSpec {
  /** with changes: the first chord's pair */
  pair: [string, string];
  range: MidiRange;
  start: number;
  instrument: InstrumentId;
  tempo: number;
  meter: Meter;
}

export interface DrillNote {
  midi: number;
  /** spelled, concert ("Eb4") */
  name: string;
  /** spelled, for the instrument */
  written: string;
  /** quarter-note beats from the first downbeat, 0-based */
  beat: number;
  /** in quarter-note beats */
  duration: number;
  /** 1-based */
  measure: number;
  /** 1-based, in the meter's own beat unit */
  beatInMeasure: number;
  source: 'a' | 'b' | 'scale';
  /** 0-based index of the note's cell */
  cell: number;
  /** index into Drill.changes (only when the spec has changes) */
  chordIndex?: number;
}

export interface Drill {
  spec: FilledDrillSpec;
  notes: DrillNote[];
  measures: number;
  /** the progression as played, one entry per chord per chorus (only when the spec has changes) */
  changes?: DrillChange[];
}

export type KeyOrder = 'chromatic' | 'fourths' | 'fifths';

export interface PlayedNote {
  midi: number;
  /** from the drill's first downbeat, taken from the MIDI event's own timestamp */
  timeMs: number;
  velocity?: number;
  durationMs?: number;
}

export interface ScoreOptions {
  tempo: number;
  mode: 'timed' | 'free';
  octaveTolerant?: boolean;
  hitWindowMs?: number;
  matchWindowMs?: number;
  /** 0.5 straight (default) .. 0.75 */
  swing?: number;
  /** semitones added to every played note before matching */
  inputTransposition?: number;
}

export type Verdict = 'hit' | 'early' | 'late' | 'wrong' | 'missed';

export interface NoteResult {
  verdict: Verdict;
  playedIndex: number | null;
  offsetMs: number | null;
}

export interface TakeScore {
  results: NoteResult[];
  extras: number[];
  accuracy: number;
  meanOffsetMs: number | null;
  spreadMs: number | null;
}

export interface ScoreUpdate {
  index: number;
  result: NoteResult;
  settled: boolean;
}

export interface LiveScorer {
  push(note: PlayedNote): ScoreUpdate[];
  tick(nowMs: number): ScoreUpdate[];
  finish(): TakeScore;
}

/** A clef a part is printed in; 'treble-8vb' reads an octave lower than written (guitar). */
export type Clef = 'treble' | 'bass' | 'treble-8vb';

/**
 * An ottava line over a note: 8 under an 8va line (printed an octave lower than written), -8
 * under an 8vb line (an octave higher); 15 and -15 are the two-octave lines, 15ma and 15mb.
 */
export type Ottava = 0 | 8 | -8 | 15 | -15;

/** One note or rest as printed: the one notation model the screen, print and MusicXML share. */
export interface NotatedEvent {
  kind: 'note' | 'rest';
  /** index into Notation.staves */
  staff: number;
  /** quarter notes from the measure's start */
  start: number;
  /** quarter notes (a triplet eighth is 1/3) */
  duration: number;
  /** index into drill.notes, for notes */
  noteIndex?: number;
  /** the written name with octave as the note sounds for the reader, before any ottava: drill.notes[noteIndex].written */
  written?: string;
  /** the sign printed, null when none is printed */
  accidental: '#' | 'b' | 'n' | null;
  /** 8: under an 8va line (printed an octave lower than written); -8: under an 8vb line; 15 and -15 likewise two octaves (15ma, 15mb) */
  ottava: Ottava;
  /** id of its beam group, unique in the measure */
  beam?: number;
  /** id of its tuplet (3 in the time of 2), unique in the measure */
  tuplet?: number;
  /** notes: the stem's direction, one per beam group (the note farthest from the middle line decides) */
  stem?: 'up' | 'down';
}

export interface NotatedMeasure {
  /** 1-based, as drill.notes' measures */
  number: number;
  /** the chord symbol over the measure's start, when the drill has changes */
  chord?: string;
  /** every chord that starts inside the measure, `start` in quarter notes from its start */
  chords?: { start: number; chord: string }[];
  events: NotatedEvent[];
}

export interface Notation {
  /** one staff, or ['treble', 'bass'] for piano's grand staff */
  staves: Clef[];
  measures: NotatedMeasure[];
}
