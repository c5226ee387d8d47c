import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import type { z } from 'zod';
import { EngineError, pairsForChord } from '../../shared/engine';
import { AssignmentFormInput } from '../../shared/schemas/assignments';
import { BookDetailsInput } from '../../shared/schemas/books';
import { FindPairsInput } from '../../shared/schemas/chords';
import { fieldErrors } from '../../shared/schemas/field-errors';
import { ImportTakeInput } from '../../shared/schemas/history';
import { loopInput } from '../../shared/schemas/practice';

/** The field map a form shows (and a 400 sends) for one input. */
const fieldsOf = (schema: z.ZodType, v: unknown) => {
  const parsed = schema.safeParse(v);
  return parsed.success ? {} : fieldErrors(parsed.error.issues);
};

describe('the browser-side schemas the form kit validates with', () => {
  it('book details: a price typed as money becomes minor units; anything else is refused on priceMinor', () => {
    const base = { title: 'Pairs', description: '', coverColour: 'ink', currency: 'EUR' };
    expect(BookDetailsInput.parse({ ...base, priceMinor: '12.00' }).priceMinor).toBe(1200);
    expect(BookDetailsInput.parse({ ...base, priceMinor: ' 4,5 ' }).priceMinor).toBe(450);
    expect(BookDetailsInput.parse({ ...base, priceMinor: '0' }).priceMinor).toBe(0);
    expect(fieldsOf(BookDetailsInput, { ...base, priceMinor: 'lots' })).toEqual({
      priceMinor: ['Type a price such as 12.00'],
    });
    expect(fieldsOf(BookDetailsInput, { ...base, priceMinor: '-3' })).toEqual({
      priceMinor: ['Type a price such as 12.00'],
    });
    // the server's own bound on the price still holds
    expect(fieldsOf(BookDetailsInput, { ...base, priceMinor: '1000.01' })).toEqual({
      priceMinor: ['The price is at most 1000.00'],
    });
  });

  it('assignment: accuracy in percent and a due day, held to the server rules under the same names', () => {
    const drillId = '7b0d3c1e-2f4a-4b5c-8d6e-9f0a1b2c3d4e';
    const good = AssignmentFormInput.parse({
      savedDrillId: drillId,
      keyOrder: null,
      targetTempo: 100,
      targetAccuracy: 85,
      dueAt: '2031-03-01',
      note: '',
    });
    expect(good.targetAccuracy).toBeCloseTo(0.85);
    // the end of that day in this machine's own time zone
    expect(good.dueAt).toBe(new Date('2031-03-01T23:59:00').toISOString());
    const bad = fieldsOf(AssignmentFormInput, {
      savedDrillId: drillId,
      targetTempo: 100,
      targetAccuracy: 2,
      dueAt: 'soon',
    });
    expect(bad).toEqual({ targetAccuracy: ['At least 5%'], dueAt: ['Pick a due date'] });
  });

  it('loop: measures inside the drill, the first no later than the last, a tempo up to the drill’s own', () => {
    let limits = { measures: 4, targetTempo: 120 };
    const schema = loopInput(() => limits);
    expect(schema.parse({ from: 2, to: 3, tempo: 100 })).toEqual({ from: 2, to: 3, tempo: 100 });
    const measures = 'Choose measures between 1 and 4, the first no later than the last.';
    expect(fieldsOf(schema, { from: 3, to: 2, tempo: 100 })).toEqual({ to: [measures] });
    expect(fieldsOf(schema, { from: 0, to: 5, tempo: 130 })).toEqual({
      from: [measures],
      to: [measures],
      tempo: ["Choose a tempo from 20 to the drill's 120 bpm."],
    });
    // the same schema follows a shorter drill
    limits = { measures: 2, targetTempo: 120 };
    expect(Object.keys(fieldsOf(schema, { from: 2, to: 3, tempo: 100 }))).toEqual(['to']);
  });

  it("fit finder: the engine's own reason for a chord it cannot read", () => {
    let reason = '';
    try {
      pairsForChord('H7');
    } catch (err) {
      if (err instanceof EngineError) reason = err.message;
    }
    expect(reason).not.toBe('');
    expect(fieldsOf(FindPairsInput, { chord: 'H7' })).toEqual({ chord: [reason] });
    expect(fieldsOf(FindPairsInput, { chord: '  ' })).toEqual({ chord: ['Type a chord symbol first, such as D7.'] });
    expect(FindPairsInput.parse({ chord: ' D7 ' })).toEqual({ chord: 'D7' });
  });

  it('import: a file is needed, at most 1 MB; the drill and the downbeat as the server reads them', () => {
    const spec = { pair: ['D', 'C'], pattern: 'four-three', direction: 'up', tempo: 100 };
    const file = new File([new Uint8Array(10)], 'take.mid');
    expect(ImportTakeInput.parse({ file, spec }).file).toBe(file);
    expect(fieldsOf(ImportTakeInput, { file: undefined, spec })).toEqual({ file: ['Choose a MIDI file'] });
    const big = new File([new Uint8Array(1024 * 1024 + 1)], 'big.mid');
    expect(fieldsOf(ImportTakeInput, { file: big, spec })).toEqual({
      file: ['At most 1 MB; a MIDI take is far smaller'],
    });
    expect(Object.keys(fieldsOf(ImportTakeInput, { file, spec: { ...spec, tempo: 5 } }))).toEqual(['spec.tempo']);
  });
});

describe('one way to write forms', () => {
  const src = fileURLToPath(new URL('../../src/', import.meta.url));
  const files = (dir: string): string[] =>
    readdirSync(dir).flatMap((name) => {
      const path = join(dir, name);
      return statSync(path).isDirectory() ? files(path) : path.endsWith('.tsx') ? [path] : [];
    });

  it('no raw input, select or text area outside the form kit and its fields', () => {
    const raw = files(src)
      .map((path) => relative(src, path))
      .filter((path) => !path.startsWith('components/ui/') && !path.startsWith('components/form/'))
      .filter((path) => /<(input|select|textarea)[\s>]/.test(readFileSync(join(src, path), 'utf8')));
    expect(raw).toEqual([]);
  });
});
