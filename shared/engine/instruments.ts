import type { Instrument, InstrumentId } from './types';

/** An instrument with the General MIDI program (0-based) its drills are written with. */
export interface InstrumentEntry extends Instrument {
  /** General MIDI Level 1 program number, 0-based */
  program: number;
  /** the clef its written part reads in */
  clef: 'treble' | 'bass';
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
    clef: 'treble',
  },
  'wind-controller': {
    label: 'Wind controller',
    transposition: 0,
    range: { low: 36, high: 96 },
    monophonic: true,
    program: 65,
    clef: 'treble',
  },
  flute: {
    label: 'Flute',
    transposition: 0,
    range: { low: 60, high: 96 },
    monophonic: true,
    program: 73,
    clef: 'treble',
  },
  clarinet: {
    label: 'Clarinet in Bb',
    transposition: -2,
    range: { low: 50, high: 91 },
    monophonic: true,
    program: 71,
    clef: 'treble',
  },
  'soprano-sax': {
    label: 'Soprano saxophone',
    transposition: -2,
    range: { low: 56, high: 87 },
    monophonic: true,
    program: 64,
    clef: 'treble',
  },
  'alto-sax': {
    label: 'Alto saxophone',
    transposition: -9,
    range: { low: 49, high: 80 },
    monophonic: true,
    program: 65,
    clef: 'treble',
  },
  'tenor-sax': {
    label: 'Tenor saxophone',
    transposition: -14,
    range: { low: 44, high: 75 },
    monophonic: true,
    program: 66,
    clef: 'treble',
  },
  'baritone-sax': {
    label: 'Baritone saxophone',
    transposition: -21,
    range: { low: 36, high: 68 },
    monophonic: true,
    program: 67,
    clef: 'treble',
  },
  trumpet: {
    label: 'Trumpet in Bb',
    transposition: -2,
    range: { low: 52, high: 82 },
    monophonic: true,
    program: 56,
    clef: 'treble',
  },
  trombone: {
    label: 'Trombone',
    transposition: 0,
    range: { low: 40, high: 72 },
    monophonic: true,
    program: 57,
    clef: 'bass',
  },
  guitar: {
    label: 'Guitar',
    transposition: -12,
    range: { low: 40, high: 86 },
    monophonic: false,
    program: 26,
    clef: 'treble',
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
