/**
 * Writes the note detector's recordings to fixtures/audio/: horn-like lines made by our own
 * synthesizer (scripts/audio/horn-synth.ts) as 12 kHz 16-bit WAV files, each with a JSON of
 * the notes in it. Run: `node --import tsx scripts/make-audio-fixtures.ts`. The same phrases
 * at 48 kHz feed the benchmark. (fixtures/audio/sox-line.* are made by make-sox-fixture.sh.)
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expectedNotes, type Phrase, renderPhrase, type SynthNote, toWav } from './audio/horn-synth';

/** Notes one after another: [midi, length ms, gap ms after, extra]. */
function line(startMs: number, notes: Array<[number, number, number, Partial<SynthNote>?]>): SynthNote[] {
  let t = startMs;
  return notes.map(([midi, durationMs, gapMs, extra]) => {
    const n: SynthNote = { midi, startMs: t, durationMs, ...extra };
    t += durationMs + gapMs;
    return n;
  });
}

/** A slurred line: every note after the first joined to the one before. */
function slurred(startMs: number, midis: number[], lengthMs: number, extra: Partial<SynthNote> = {}): SynthNote[] {
  return midis.map((midi, i) => ({
    midi,
    startMs: startMs + i * lengthMs,
    durationMs: lengthMs,
    legato: i > 0,
    ...extra,
  }));
}

export function phrases(sampleRate: number): Phrase[] {
  return [
    {
      name: 'detached',
      description: 'Tongued eighths at 150 bpm, a C/D triad pair up and down, levels from -14 to -26 dBFS',
      sampleRate,
      noiseDb: -62,
      seed: 1,
      notes: line(
        200,
        [60, 64, 67, 62, 66, 69, 72, 76, 79, 74, 78, 81].map((m, i) => [
          m,
          150,
          50,
          { db: -14 - (i % 4) * 4, attackMs: 15 + (i % 3) * 10 },
        ]),
      ),
    },
    {
      name: 'legato',
      description: 'A slurred line in the alto register with 5.5 Hz vibrato of 25 cents, 180 ms a note',
      sampleRate,
      noiseDb: -60,
      seed: 2,
      notes: slurred(150, [77, 74, 70, 67, 73, 71, 66, 62, 65, 61, 58, 54], 180, {
        db: -20,
        vibrato: { hz: 5.5, cents: 25 },
      }),
    },
    {
      name: 'bends',
      description: 'Scooped attacks (up to 90 cents flat), wide vibrato (45 cents), repeated notes, MIDI 40 to 88',
      sampleRate,
      noiseDb: -60,
      seed: 3,
      notes: line(150, [
        [62, 260, 40, { bend: { cents: -90, ms: 50 } }],
        [62, 200, 60, { bend: { cents: -60, ms: 40 } }],
        [65, 300, 40, { vibrato: { hz: 6, cents: 45 } }],
        [40, 260, 40, { bend: { cents: -70, ms: 45 } }],
        [88, 220, 40, { bend: { cents: -80, ms: 45 }, db: -22 }],
        [69, 340, 40, { vibrato: { hz: 5, cents: 45 }, bend: { cents: -50, ms: 40 } }],
        [69, 200, 40, {}],
        [57, 240, 0, { bend: { cents: 60, ms: 40 } }],
      ]),
    },
    {
      name: 'noisy',
      description:
        'Quiet notes (-30 dBFS) over a -52 dBFS noise floor with heavy breath, slurred pairs and tongued notes',
      sampleRate,
      noiseDb: -52,
      breathDb: -20,
      seed: 4,
      notes: [
        ...slurred(200, [67, 71, 74], 200, { db: -30 }),
        ...line(860, [
          [72, 180, 60, { db: -31 }],
          [76, 180, 60, { db: -29, vibrato: { hz: 5.5, cents: 30 } }],
          [79, 180, 60, { db: -32 }],
        ]),
        ...slurred(1620, [64, 60], 220, { db: -30 }),
      ],
    },
  ];
}

export const FIXTURE_RATE = 12000;

const isMain = process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1];
if (isMain) {
  const dir = fileURLToPath(new URL('../fixtures/audio/', import.meta.url));
  mkdirSync(dir, { recursive: true });
  for (const p of phrases(FIXTURE_RATE)) {
    const samples = renderPhrase(p);
    writeFileSync(`${dir}${p.name}.wav`, toWav(samples, p.sampleRate));
    const json = { description: p.description, sampleRate: p.sampleRate, notes: expectedNotes(p) };
    writeFileSync(`${dir}${p.name}.json`, `${JSON.stringify(json, null, 2)}\n`);
    console.log(`${p.name}: ${p.notes.length} notes, ${(samples.length / p.sampleRate).toFixed(2)} s`);
  }
}
