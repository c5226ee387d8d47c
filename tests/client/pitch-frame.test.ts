import { describe, expect, it } from 'vitest';
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
});
