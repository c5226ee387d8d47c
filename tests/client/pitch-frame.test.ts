import { Note } from 'tonal';
import { describe, expect, it } from 'vitest';
import { generateDrill, parseTriad } from '../../shared/engine';
import { pairTitle } from '../../src/features/drills/components/written-pair';
import { pitchFrame } from '../../src/features/practice/lib/pitch-frame';

describe('pitch frame', () => {
  it('leaves a concert-pitch player as it is', () => {
    const f = pitchFrame('piano');
    expect(f.transposing).toBe(false);
    expect(f.key('Eb')).toBe('Eb');
    expect(f.pair(['F', 'Eb'])).toEqual(['F', 'Eb']);
    expect(f.written(60)).toBe(60);
  });

  it('names everything in written pitch for an alto saxophone', () => {
    // From memory: the alto saxophone in Eb sounds a major sixth below written.
    const f = pitchFrame('alto-sax');
    expect(f.transposing).toBe(true);
    expect(f.key('Eb')).toBe('C');
    expect(f.key('C')).toBe('A');
    expect(f.pair(['F', 'Eb'])).toEqual(['D', 'C']);
    expect(f.chord('Cmaj7#11')).toBe('Amaj7#11');
    // concert Db3 is the alto's lowest note, written Bb3
    expect(f.name(f.written(49))).toBe('Bb3');
  });

  it('names a Bb instrument a whole step up (tenor an octave more)', () => {
    // From memory: trumpet and clarinet in Bb sound a major second below written, tenor a ninth.
    expect(pitchFrame('trumpet').key('Bb')).toBe('C');
    expect(pitchFrame('tenor-sax').written(60)).toBe(74);
    expect(pitchFrame('tenor-sax').key('Bb')).toBe('C');
  });

  it('spells a played note like the note it is compared with', () => {
    const f = pitchFrame('alto-sax');
    expect(f.name(71, 'Cb5')).toBe('Cb5');
    expect(f.name(61, 'C#4')).toBe('C#4');
    expect(f.name(61, 'D4')).toBe('Db4');
    // a concert B3 played against a written B3 reads as the written note it sounds: G#4, not B3
    expect(f.name(f.written(59), 'B3')).toBe('Ab4');
  });

  it('names a written pair as one unit, as the staff writes it (never triad by triad)', () => {
    // From memory: a B-flat trumpet reads a major second above concert. Triad by triad, concert
    // F# / E would read Ab / F#; as a unit it is Ab / Gb, a whole step apart like the concert pair.
    expect(pitchFrame('trumpet').pair(['F#', 'E'])).toEqual(['Ab', 'Gb']);
    const drill = generateDrill({ pair: ['F#', 'E'], pattern: 'stack', direction: 'up', instrument: 'trumpet' });
    expect(pairTitle(drill)).toBe('F# / E (written Ab / Gb)');
    // every written note is a note of the written pair, by name (tonal reads the pitch class)
    const names = new Set(['Ab', 'Gb'].flatMap((s) => parseTriad(s).pitchClasses));
    for (const n of drill.notes) expect(names.has(Note.pitchClass(n.written))).toBe(true);
    // a concert-pitch instrument keeps the pair as it is
    expect(pairTitle(generateDrill({ pair: ['F#', 'E'], pattern: 'stack', direction: 'up' }))).toBe('F# / E');
  });

  it('names a drill’s key in the frame by the same rule as its written pair', () => {
    const alto = pitchFrame('alto-sax');
    // concert B / A reads Ab / Gb on alto, Bm / A reads G#m / F#: the key follows the pair
    expect(alto.pair(['Bm', 'A'])).toEqual(['G#m', 'F#']);
    expect(alto.drillKey({ pair: ['Bm', 'A'] })).toBe('G#');
    expect(alto.drillKey({ pair: ['B', 'A'] })).toBe('Ab');
    expect(pitchFrame('trumpet').drillKey({ pair: ['F#', 'E'] })).toBe('Ab');
    // over a progression, the first chord's root as written (concert Eb7 reads C7 on alto)
    expect(alto.drillKey({ changes: [{ chord: 'Eb7', beats: 4 }] })).toBe('C');
    // concert pitch: the key as the key map counts it
    expect(pitchFrame('piano').drillKey({ pair: ['C#m', 'B'] })).toBe('Db');
  });
});
