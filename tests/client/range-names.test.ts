import { describe, expect, it } from 'vitest';
import { generateDrill } from '../../shared/engine';
import { drillLengthProblem, writtenName } from '../../src/components/notation/drill-length';
import { noteName, parseNoteName } from '../../src/lib/note-names';

describe('note names typed for a range', () => {
  it.each([
    // MIDI 1.0 numbering with scientific octaves: middle C is C4, 60 (tonal agrees).
    ['C4', 60],
    ['C3', 48],
    ['Bb4', 70],
    ['f#5', 78],
    ['B♭3', 58],
    ['Cb4', 59],
    ['A0', 21],
  ])('%s is MIDI %i', (text, midi) => {
    expect(parseNoteName(text)).toEqual({ midi });
  });

  it.each([
    ['', /Type a note name/],
    ['C', /needs an octave number/],
    ['H3', /not a note name/],
    ['60', /not a note name/],
    ['G#9', /outside the notes MIDI can name/],
  ])('“%s” is refused with a message that says why', (text, message) => {
    const r = parseNoteName(text);
    expect('error' in r && r.error).toMatch(message);
  });

  it('names a MIDI note back with its octave', () => {
    expect(noteName(61)).toBe('Db4');
    expect(noteName(48)).toBe('C3');
  });
});

describe('a drill that is too short to look finished', () => {
  it('names the player’s written pitch for a transposing instrument', () => {
    // Alto saxophone reads a major sixth above concert (common practice): concert Db3 is written Bb3.
    const drill = generateDrill({ pair: ['C', 'D'], pattern: 'four-three', direction: 'up', instrument: 'alto-sax' });
    expect(writtenName(49, drill)).toBe('Bb3');
  });

  it('says so for a drill of one bar', () => {
    const drill = generateDrill({
      pair: ['E', 'D'],
      pattern: 'stack',
      direction: 'up',
      instrument: 'wind-controller',
      range: { low: 67, high: 96 },
    });
    expect(drill.notes.at(-1)!.measure).toBe(1);
    expect(drillLengthProblem(drill)).toMatch(/^Only one bar/);
  });

  it('says nothing for a drill that runs its range', () => {
    const drill = generateDrill({ pair: ['C', 'D'], pattern: 'four-three', direction: 'up', instrument: 'alto-sax' });
    expect(drill.measures).toBeGreaterThanOrEqual(2);
    expect(drillLengthProblem(drill)).toBeNull();
  });
});
