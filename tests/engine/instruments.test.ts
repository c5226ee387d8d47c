import { Note } from 'tonal';
import { describe, expect, it } from 'vitest';
import { generateDrill, instruments } from '../../shared/engine';

describe('instruments', () => {
  it('lists the eleven instruments of the contract', () => {
    expect(Object.keys(instruments).sort()).toEqual(
      [
        'piano',
        'wind-controller',
        'flute',
        'clarinet',
        'soprano-sax',
        'alto-sax',
        'tenor-sax',
        'baritone-sax',
        'trumpet',
        'trombone',
        'guitar',
      ].sort(),
    );
  });

  it.each([
    // transpositions, written -> concert, from memory (standard orchestration practice)
    ['piano', 0],
    ['flute', 0],
    ['clarinet', -2], // from memory: Bb clarinet sounds a major second below written
    ['soprano-sax', -2], // from memory: Bb soprano sounds a major second below written
    ['alto-sax', -9], // from memory: Eb alto sounds a major sixth below written
    ['tenor-sax', -14], // from memory: Bb tenor sounds a major ninth below written
    ['baritone-sax', -21], // from memory: Eb baritone sounds an octave and a major sixth below
    ['trumpet', -2], // from memory: Bb trumpet sounds a major second below written
    ['trombone', 0], // from memory: trombone reads bass clef at concert pitch
    ['guitar', -12], // from memory: guitar is written an octave above its sound
  ] as const)('%s transposes by %i', (id, semitones) => {
    expect(instruments[id].transposition).toBe(semitones);
  });

  it.each([
    // ranges at concert pitch, from memory
    ['piano', 'A0', 'C8'], // from memory: 88 keys, A0 (MIDI 21) to C8 (MIDI 108), MIDI 1.0 numbering
    ['flute', 'C4', 'C7'], // from memory
    ['clarinet', 'D3', 'G6'], // from memory: written E3 to A6
    ['soprano-sax', 'Ab3', 'Eb6'], // from memory: written Bb3 to F6
    ['alto-sax', 'Db3', 'Ab5'], // from memory: written Bb3 to F6
    ['tenor-sax', 'Ab2', 'Eb5'], // from memory: written Bb3 to F6
    ['baritone-sax', 'C2', 'Ab4'], // from memory: written A3 (low A horn) to F6
    ['trumpet', 'E3', 'Bb5'], // from memory: written F#3 to C6
    ['trombone', 'E2', 'C5'], // from memory
    ['guitar', 'E2', 'D6'], // from memory: open low E to the 22nd fret of the high E string
  ] as const)('%s sounds from %s to %s', (id, low, high) => {
    expect(instruments[id].range).toEqual({ low: Note.midi(low), high: Note.midi(high) });
  });

  it('the saxophones share one written range', () => {
    // from memory: every saxophone reads the same written compass (Bb3 to F6; the baritone adds low A)
    for (const id of ['soprano-sax', 'alto-sax', 'tenor-sax'] as const) {
      const { range, transposition } = instruments[id];
      expect([range.low - transposition, range.high - transposition]).toEqual([Note.midi('Bb3'), Note.midi('F6')]);
    }
  });

  it('marks the single-line instruments monophonic', () => {
    expect(instruments.piano.monophonic).toBe(false);
    expect(instruments.guitar.monophonic).toBe(false);
    expect(instruments['wind-controller'].monophonic).toBe(true);
    expect(instruments['alto-sax'].monophonic).toBe(true);
  });

  // The written part now spells the pair as one unit: B/C on alto reads G#/A (Ab/Bbb would need a
  // double flat), so the example pairs B with A, a whole step below, as the contract's example does.
  it('writes B major for alto sax in Ab major, not G# major', () => {
    const d = generateDrill({ pair: ['B', 'A'], pattern: 'stack', direction: 'up', instrument: 'alto-sax' });
    const b = d.notes.filter((n) => n.source === 'a');
    for (const n of b) {
      expect(['Ab', 'C', 'Eb']).toContain(Note.pitchClass(n.written));
      expect(Note.midi(n.written)).toBe(n.midi + 9); // written = concert - transposition
    }
  });

  it.each([
    ['tenor-sax', 'F', 'G', 'B'], // from memory: concert F on tenor is written G a ninth up
    ['trumpet', 'Eb', 'F', 'D'], // from memory
    ['clarinet', 'Bb', 'C', 'B'], // from memory
    ['baritone-sax', 'Eb', 'C', 'D'], // from memory
    ['guitar', 'F', 'F', 'B'], // from memory
  ] as const)('%s writes concert %s as %s', (instrument, concert, written, other) => {
    const d = generateDrill({ pair: [concert, other], pattern: 'weave', direction: 'up', instrument });
    const first = d.notes.find((n) => Note.pitchClass(n.name) === concert)!;
    expect(Note.pitchClass(first.written)).toBe(written);
    expect(Note.midi(first.written)! - first.midi).toBe(-instruments[instrument].transposition);
  });
});
