import { createLiveScorer, type DrillNote, type PlayedNote, type ScoreOptions, scoreTake } from '../../shared/engine';

/**
 * Scoring figures: takes of 1,000 and 10,000 eighth notes at 120 bpm with 5 % mistakes (wrong
 * pitches, left-out notes, extras, a few far off), scored in one batch and note by note through
 * the live scorer (push per note, a tick per 16 ms frame between notes, then finish). Goal: 10k
 * under 50 ms, cost growing linearly.
 */
const TEMPO = 120;
const OPTIONS: ScoreOptions = { tempo: TEMPO, mode: 'timed' };
const HEXATONIC = [65, 67, 69, 70, 72, 75]; // F/Eb over two octaves
const PITCHES = [...HEXATONIC, ...HEXATONIC.map((p) => p + 12)];

function random(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s * 1664525 + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

function take(size: number): { expected: DrillNote[]; played: PlayedNote[] } {
  const r = random(size);
  const expected: DrillNote[] = [];
  const played: PlayedNote[] = [];
  for (let k = 0; k < size; k++) {
    const beat = k / 2;
    const midi = PITCHES[(k * 5) % PITCHES.length];
    expected.push({
      midi,
      name: '',
      written: '',
      beat,
      duration: 0.5,
      measure: Math.floor(beat / 4) + 1,
      beatInMeasure: (beat % 4) + 1,
      source: 'scale',
      cell: Math.floor(k / 8),
    });
    const t = (beat * 60000) / TEMPO + (r() - 0.5) * 60;
    const roll = r();
    if (roll < 0.0125) continue; // left out
    if (roll < 0.025)
      played.push({ midi: midi + 1, timeMs: t }); // wrong
    else if (roll < 0.0375)
      played.push({ midi, timeMs: t + 200 }); // far off
    else played.push({ midi, timeMs: t });
    if (roll > 0.9875) played.push({ midi: midi + 2, timeMs: t + 90 }); // extra
  }
  played.sort((x, y) => x.timeMs - y.timeMs);
  return { expected, played };
}

function median(xs: number[]): number {
  const s = [...xs].sort((x, y) => x - y);
  return s[Math.floor(s.length / 2)];
}

/** Median and best of `runs` laps; the best is the steadier figure on a busy machine. */
function time(runs: number, f: () => void): { median: number; best: number } {
  const laps: number[] = [];
  for (let k = 0; k < runs; k++) {
    const t0 = performance.now();
    f();
    laps.push(performance.now() - t0);
  }
  return { median: median(laps), best: Math.min(...laps) };
}

const fmt = (t: { median: number; best: number }, size: number) =>
  `${t.median.toFixed(2)} ms median, ${t.best.toFixed(2)} ms best (${((t.best / size) * 1000).toFixed(2)} us/note)`;

function live(expected: DrillNote[], played: PlayedNote[]): void {
  const scorer = createLiveScorer(expected, OPTIONS);
  let clock = 0;
  for (const note of played) {
    for (; clock + 16 < note.timeMs; clock += 16) scorer.tick(clock);
    scorer.push(note);
  }
  scorer.tick(clock + 10_000);
  scorer.finish();
}

export async function run(): Promise<void> {
  // let the JIT settle on a take of its own before anything is measured
  const warm = take(2_000);
  for (let k = 0; k < 5; k++) {
    scoreTake(warm.expected, warm.played, OPTIONS);
    live(warm.expected, warm.played);
  }
  const rows: string[] = [];
  const perNote: number[] = [];
  for (const size of [1_000, 10_000]) {
    const { expected, played } = take(size);
    const batch = time(11, () => scoreTake(expected, played, OPTIONS));
    const liveMs = time(7, () => live(expected, played));
    const score = scoreTake(expected, played, OPTIONS);
    perNote.push(batch.best / size, liveMs.best / size);
    rows.push(`${String(size).padStart(6)} notes, accuracy ${score.accuracy.toFixed(3)}`);
    rows.push(`  batch: ${fmt(batch, size)}`);
    rows.push(`  live (push per note, tick per 16 ms frame, finish): ${fmt(liveMs, size)}`);
  }
  for (const row of rows) console.log(row);
  console.log(
    `cost per note, 10k against 1k (1.0 = linear): batch ${(perNote[2] / perNote[0]).toFixed(2)}, live ${(perNote[3] / perNote[1]).toFixed(2)}`,
  );
}
