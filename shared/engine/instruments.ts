import { movePair, semitoneInterval } from './theory/pair-spelling';
import type { Clef, Instrument, InstrumentId, MidiRange } from './types';

/** The clef an instrument reads: one staff's clef, or 'grand' (treble and bass) for piano. */
export type InstrumentClef = Clef | 'grand';

/** An instrument with the General MIDI program (0-based) its drills are written with. */
export interface InstrumentEntry extends Instrument {
  /** General MIDI Level 1 program number, 0-based */
  program: number;
  /** the clef its written part reads in: 'grand' is piano's treble and bass staves */
  clef: InstrumentClef;
  /**
   * A drill's default range, concert MIDI inclusive: the part of `range` a player drills in,
   * chosen so that the written part needs no more than four ledger lines on its staff.
   */
  drillRange: MidiRange;
}

/**
 * The instruments Sixfold writes drills for. `transposition` is semitones from written to concert
 * pitch (concert = written + transposition); `range` is concert MIDI, inclusive. Ranges are a
 * comfortable professional compass rather than the extreme altissimo.
 *
 * @example
 * instruments['alto-sax'].transposition // -9: written C sounds Eb a major sixth lower
 */
export const instruments: Record<InstrumentId, InstrumentEntry> = {
  piano: {
    label: 'Piano',
    transposition: 0,
    range: { low: 21, high: 108 },
    monophonic: false,
    program: 0,
    clef: 'grand',
    // C3-C6
    drillRange: { low: 48, high: 84 },
  },
  'wind-controller': {
    label: 'Wind controller',
    transposition: 0,
    range: { low: 36, high: 96 },
    monophonic: true,
    program: 65,
    clef: 'treble',
    // an alto saxophone's sounding range, Db3-Ab5
    drillRange: { low: 49, high: 80 },
  },
  flute: {
    label: 'Flute',
    transposition: 0,
    range: { low: 60, high: 96 },
    monophonic: true,
    program: 73,
    clef: 'treble',
    // C4-A6
    drillRange: { low: 60, high: 93 },
  },
  clarinet: {
    label: 'Clarinet in Bb',
    transposition: -2,
    range: { low: 50, high: 91 },
    monophonic: true,
    program: 71,
    clef: 'treble',
    // written E3-A6
    drillRange: { low: 50, high: 91 },
  },
  'soprano-sax': {
    label: 'Soprano saxophone',
    transposition: -2,
    range: { low: 56, high: 87 },
    monophonic: true,
    program: 64,
    clef: 'treble',
    // written Bb3-F6
    drillRange: { low: 56, high: 87 },
  },
  'alto-sax': {
    label: 'Alto saxophone',
    transposition: -9,
    range: { low: 49, high: 80 },
    monophonic: true,
    program: 65,
    clef: 'treble',
    // written Bb3-F6
    drillRange: { low: 49, high: 80 },
  },
  'tenor-sax': {
    label: 'Tenor saxophone',
    transposition: -14,
    range: { low: 44, high: 75 },
    monophonic: true,
    program: 66,
    clef: 'treble',
    // written Bb3-F6
    drillRange: { low: 44, high: 75 },
  },
  'baritone-sax': {
    label: 'Baritone saxophone',
    transposition: -21,
    range: { low: 36, high: 68 },
    monophonic: true,
    program: 67,
    clef: 'treble',
    // written A3-F6
    drillRange: { low: 36, high: 68 },
  },
  trumpet: {
    label: 'Trumpet in Bb',
    transposition: -2,
    range: { low: 52, high: 82 },
    monophonic: true,
    program: 56,
    clef: 'treble',
    // written F#3-C6
    drillRange: { low: 52, high: 82 },
  },
  trombone: {
    label: 'Trombone',
    transposition: 0,
    range: { low: 40, high: 72 },
    monophonic: true,
    program: 57,
    clef: 'bass',
    // E2-C5
    drillRange: { low: 40, high: 72 },
  },
  guitar: {
    label: 'Guitar',
    transposition: -12,
    range: { low: 40, high: 86 },
    monophonic: false,
    program: 26,
    clef: 'treble-8vb',
    // written E3-A6, read an octave lower
    drillRange: { low: 40, high: 81 },
  },
};

/**
 * Reads an instrument id, or undefined when Sixfold has no such instrument.
 *
 * @example
 * instrumentOf('kazoo') // undefined
 */
export function instrumentOf(id: string): InstrumentEntry | undefined {
  return Object.hasOwn(instruments, id) ? instruments[id as InstrumentId] : undefined;
}

/**
 * The pair as an instrument reads it: moved by the instrument's interval and spelled as one unit
 * (intervals keep their names, no double sharps or flats). Use it wherever written pair names
 * are shown, so they agree with the drill's written notes.
 *
 * @example
 * writtenPair(['F#', 'E'], 'trumpet') // ['Ab', 'Gb']
 * writtenPair(['B', 'A'], 'alto-sax') // ['Ab', 'Gb']
 */
export function writtenPair(pair: [string, string], instrument: InstrumentId): [string, string] {
  return movePair(pair, semitoneInterval(-instruments[instrument].transposition));
}
