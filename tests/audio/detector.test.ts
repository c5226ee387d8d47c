import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createNoteDetector, detectNotes } from '../../shared/audio';
import { EngineError, type PlayedNote } from '../../shared/engine';
import { expectedNotes, readWav, renderPhrase } from '../../scripts/audio/horn-synth';
import { phrases } from '../../scripts/make-audio-fixtures';

// The recordings in fixtures/audio/: four made by scripts/make-audio-fixtures.ts (our own
// horn-like synthesizer) and one by scripts/make-sox-fixture.sh (SoX's synth), each with the
// notes written into it.
const FIXTURES = ['detached', 'legato', 'bends', 'noisy', 'sox-line'];

interface Fixture {
  samples: Float32Array;
  sampleRate: number;
  notes: Array<{ midi: number; timeMs: number; durationMs: number }>;
}

function fixture(name: string): Fixture {
  const url = (ext: string) => new URL(`../../fixtures/audio/${name}.${ext}`, import.meta.url);
  const { samples, sampleRate } = readWav(readFileSync(url('wav')));
  const { notes } = JSON.parse(readFileSync(url('json'), 'utf8'));
  return { samples, sampleRate, notes };
}

/** The detector fed in blocks of the given sizes (cycled), each stamped with its start time. */
function streamed(samples: Float32Array, sampleRate: number, sizes: number[], offsetMs = 0): PlayedNote[] {
  const detector = createNoteDetector(sampleRate);
  const notes: PlayedNote[] = [];
  let i = 0;
  let k = 0;
  while (i < samples.length) {
    const n = sizes[k++ % sizes.length];
    notes.push(...detector.push(samples.slice(i, i + n), offsetMs + (i * 1000) / sampleRate));
    i += n;
  }
  notes.push(...detector.flush());
  return notes;
}

describe('detectNotes on the recorded fixtures', () => {
  for (const name of FIXTURES) {
    it(`${name}: every note, at its pitch, within 25 ms of its onset`, () => {
      const f = fixture(name);
      const notes = detectNotes(f.samples, f.sampleRate);
      expect(notes.map((n) => n.midi)).toEqual(f.notes.map((n) => n.midi));
      notes.forEach((n, i) => {
        expect(Math.abs(n.timeMs - f.notes[i].timeMs)).toBeLessThanOrEqual(25);
        // The end is where the level falls under the gate or the next note starts.
        expect(Math.abs((n.durationMs ?? 0) - f.notes[i].durationMs)).toBeLessThanOrEqual(40);
        expect(n.velocity).toBeGreaterThanOrEqual(1);
        expect(n.velocity).toBeLessThanOrEqual(127);
      });
    });
  }

  it('gives a louder onset a higher velocity', () => {
    // The detached line's notes fall by 4 dB from each to the next, four at a time.
    const f = fixture('detached');
    const v = detectNotes(f.samples, f.sampleRate).map((n) => n.velocity ?? 0);
    for (const start of [0, 4, 8]) {
      expect(v[start]).toBeGreaterThan(v[start + 1]);
      expect(v[start + 1]).toBeGreaterThan(v[start + 2]);
      expect(v[start + 2]).toBeGreaterThan(v[start + 3]);
    }
  });
});

describe('the streaming detector', () => {
  for (const name of FIXTURES) {
    it(`${name}: the same notes as detectNotes, whatever the blocks`, () => {
      const f = fixture(name);
      const batch = detectNotes(f.samples, f.sampleRate);
      // 128 frames is the audio worklet's render quantum; the others are odd on purpose.
      for (const sizes of [[128], [1, 7, 333, 4096], [2048, 5]]) {
        expect(streamed(f.samples, f.sampleRate, sizes)).toEqual(batch);
      }
    });
  }

  it('the same notes as detectNotes for any way of cutting the samples into blocks (property)', () => {
    const f = fixture('bends');
    const batch = detectNotes(f.samples, f.sampleRate);
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 1, max: 5000 }), { minLength: 1, maxLength: 8 }), (sizes) => {
        expect(streamed(f.samples, f.sampleRate, sizes)).toEqual(batch);
      }),
      { numRuns: 12 },
    );
  });

  it('answers a note once its onset is certain, and fills in its length when it ends', () => {
    const f = fixture('detached');
    const detector = createNoteDetector(f.sampleRate);
    const firstEnd = Math.round(((f.notes[0].timeMs + 100) * f.sampleRate) / 1000);
    const early = detector.push(f.samples.slice(0, firstEnd), 0);
    expect(early).toHaveLength(1);
    expect(early[0].midi).toBe(f.notes[0].midi);
    expect(early[0].durationMs).toBeUndefined();
    detector.push(f.samples.slice(firstEnd), (firstEnd * 1000) / f.sampleRate);
    expect(early[0].durationMs).toBeGreaterThan(100);
  });

  it('times notes on the clock the blocks give, and follows a jump in it', () => {
    const f = fixture('detached');
    const batch = detectNotes(f.samples, f.sampleRate);
    const shifted = streamed(f.samples, f.sampleRate, [128], 5000);
    expect(shifted.map((n) => n.timeMs)).toEqual(batch.map((n) => Math.round((n.timeMs + 5000) * 10) / 10));
    // A block that starts 1 s later than the samples before it: notes after it move by 1 s.
    const cut = Math.round(1.1 * f.sampleRate); // a rest between the 5th and 6th notes
    const detector = createNoteDetector(f.sampleRate);
    const notes = [
      ...detector.push(f.samples.slice(0, cut), 0),
      ...detector.push(f.samples.slice(cut), (cut * 1000) / f.sampleRate + 1000),
      ...detector.flush(),
    ];
    expect(notes.map((n) => n.midi)).toEqual(batch.map((n) => n.midi));
    expect(notes[2].timeMs).toBeCloseTo(batch[2].timeMs, 5);
    expect(notes[8].timeMs).toBeCloseTo(batch[8].timeMs + 1000, 0);
  });
});

describe('the gate and the range', () => {
  it('hears nothing in noise alone, nor in a line played under the gate', () => {
    const f = fixture('noisy');
    const noiseOnly = f.samples.slice(0, Math.round(0.18 * f.sampleRate));
    expect(detectNotes(noiseOnly, f.sampleRate)).toEqual([]);
    expect(detectNotes(new Float32Array(f.sampleRate), f.sampleRate)).toEqual([]);
    // -30 dBFS notes 20 dB quieter sit under the default gate of -45 dBFS.
    const quiet = f.samples.map((x) => x / 10);
    expect(detectNotes(quiet, f.sampleRate)).toEqual([]);
    // A lower gate hears them again.
    expect(detectNotes(quiet, f.sampleRate, { threshold: -60 }).map((n) => n.midi)).toEqual(f.notes.map((n) => n.midi));
  });

  it('a gate above the notes hears nothing', () => {
    const f = fixture('noisy');
    expect(detectNotes(f.samples, f.sampleRate, { threshold: -20 })).toEqual([]);
  });

  it('leaves out notes outside the range it was given', () => {
    const f = fixture('bends');
    const notes = detectNotes(f.samples, f.sampleRate, { low: 45, high: 84 });
    expect(notes.map((n) => n.midi)).toEqual(f.notes.map((n) => n.midi).filter((m) => m >= 45 && m <= 84));
  });

  it('refuses options that make no sense, in words', () => {
    const s = new Float32Array(100);
    expect(() => detectNotes(s, 48000, { low: 80, high: 60 })).toThrow(EngineError);
    expect(() => detectNotes(s, 48000, { threshold: 6 })).toThrow(/gate/);
    expect(() => detectNotes(s, 100)).toThrow(/sample rate/);
    expect(() => detectNotes(s, 8000, { high: 120 })).toThrow(/highest note/);
    expect(() => createNoteDetector(48000).push([0, 1] as unknown as Float32Array, 0)).toThrow(EngineError);
  });
});

describe('at the rates a sound card runs', () => {
  for (const rate of [44100, 48000]) {
    it(`${rate} Hz: the synthesized lines, every note at its pitch`, () => {
      for (const p of phrases(rate)) {
        const notes = detectNotes(renderPhrase(p), rate);
        const want = expectedNotes(p);
        expect(notes.map((n) => n.midi)).toEqual(want.map((n) => n.midi));
        notes.forEach((n, i) => {
          expect(Math.abs(n.timeMs - want[i].timeMs)).toBeLessThanOrEqual(25);
        });
      }
    });
  }
});
