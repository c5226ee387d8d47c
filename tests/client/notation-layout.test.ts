import { describe, expect, it } from 'vitest';
import { generateDrill, notate } from '../../shared/engine';
import { narrowestLine, naturalWidth, planSystems } from '../../src/components/notation/layout';
import { diatonicStep, parseWritten, printedOctave, printedValue } from '../../src/components/notation/pitch';

/** The printed name of a note ("Bb5"). */
const printed = (written: string, ottava: Parameters<typeof printedOctave>[1]) => {
  const p = printedOctave(written, ottava);
  return `${p.letter}${p.accidental}${p.octave}`;
};

describe('what the staff prints for a note of the model', () => {
  it('prints a triplet eighth as an eighth and a dotted quarter with its dot', () => {
    expect(printedValue(1 / 3, true)).toEqual({ code: '8', dots: 0 });
    expect(printedValue(0.5, false)).toEqual({ code: '8', dots: 0 });
    expect(printedValue(1.5, false)).toEqual({ code: 'q', dots: 1 });
    expect(printedValue(4, false)).toEqual({ code: 'w', dots: 0 });
    expect(printedValue(0.3, false)).toBeNull();
  });

  it('prints a note under an 8va line an octave lower, under 8vb an octave higher (common practice)', () => {
    expect(printed('Bb6', 8)).toBe('Bb5');
    expect(printed('F#1', -8)).toBe('F#2');
    expect(printed('C4', 0)).toBe('C4');
  });

  it('prints a note under a 15ma line two octaves lower, under 15mb two octaves higher (common practice)', () => {
    expect(printed('C8', 15)).toBe('C6');
    expect(printed('Bb7', 15)).toBe('Bb5');
    expect(printed('D0', -15)).toBe('D2');
  });

  it('counts diatonic steps from C0, so E4 sits a third above C4', () => {
    expect(diatonicStep(parseWritten('E4')) - diatonicStep(parseWritten('C4'))).toBe(2);
    expect(diatonicStep(parseWritten('Cb4'))).toBe(diatonicStep(parseWritten('C4')));
  });
});

describe('lines of music', () => {
  const drill = generateDrill({ pair: ['C', 'D'], pattern: 'four-three', direction: 'up', instrument: 'alto-sax' });
  const notation = notate(drill);

  it('puts every measure on exactly one line, in order, within the width', () => {
    const systems = planSystems(notation.measures, 1, 1000);
    expect(systems.flatMap((s) => s.measures)).toEqual(notation.measures.map((_m, i) => i));
    for (const s of systems) expect(s.widths.reduce((a, b) => a + b, 0)).toBeLessThanOrEqual(1000);
  });

  it('never squeezes a busy measure below a readable width: a phone scales the drawing instead', () => {
    const busiest = Math.max(...notation.measures.map((m) => naturalWidth(m, 1)));
    // A line holds the clef and time signature and the busiest bar at no less than 85% of its room.
    expect(narrowestLine(notation)).toBeGreaterThanOrEqual(busiest * 0.85 + 60);
  });
});
