/**
 * Listening to an acoustic instrument: how many notes the detector gets at the right pitch,
 * the p95 of its onset error, and its cost as seconds of audio per second of compute.
 * Recordings: the fixtures in fixtures/audio/ (12 kHz, four horn-like lines of our own
 * synthesizer and one made by SoX), plus the same four lines rendered at 44.1 and 48 kHz.
 * Cost: the four lines at 48 kHz (a sound card's rate) back to back, whole and in blocks of 128
 * samples (what the audio worklet posts).
 */
import { readFileSync } from 'node:fs';
import { createNoteDetector, detectNotes } from '../../shared/audio';
import type { PlayedNote } from '../../shared/engine';
import { type ExpectedNote, expectedNotes, readWav, renderPhrase } from '../audio/horn-synth';
import { phrases } from '../make-audio-fixtures';

const FIXTURES = ['detached', 'legato', 'bends', 'noisy', 'sox-line'];

const pct = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor((p / 100) * s.length))];
};

/** Each expected note against the detected note nearest its onset (within 100 ms). */
function compare(expected: ExpectedNote[], played: PlayedNote[]) {
  let right = 0;
  const errors: number[] = [];
  for (const e of expected) {
    let best: PlayedNote | null = null;
    for (const p of played)
      if (
        Math.abs(p.timeMs - e.timeMs) <= 100 &&
        (!best || Math.abs(p.timeMs - e.timeMs) < Math.abs(best.timeMs - e.timeMs))
      )
        best = p;
    if (!best) continue;
    errors.push(Math.abs(best.timeMs - e.timeMs));
    if (best.midi === e.midi) right++;
  }
  return { right, errors, extra: Math.max(0, played.length - errors.length) };
}

function recordings() {
  const out: Array<{ name: string; samples: Float32Array; rate: number; notes: ExpectedNote[] }> = [];
  for (const name of FIXTURES) {
    const url = (ext: string) => new URL(`../../fixtures/audio/${name}.${ext}`, import.meta.url);
    const { samples, sampleRate } = readWav(readFileSync(url('wav')));
    out.push({ name, samples, rate: sampleRate, notes: JSON.parse(readFileSync(url('json'), 'utf8')).notes });
  }
  for (const rate of [44100, 48000])
    for (const p of phrases(rate))
      out.push({ name: `${p.name}@${rate}`, samples: renderPhrase(p), rate, notes: expectedNotes(p) });
  return out;
}

function timeIt(fn: () => void, runs: number) {
  fn(); // warm
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < runs; i++) {
    const c = process.cpuUsage();
    const t = performance.now();
    fn();
    wall.push(performance.now() - t);
    const d = process.cpuUsage(c);
    cpu.push((d.user + d.system) / 1000);
  }
  return { wall: pct(wall, 50), cpu: pct(cpu, 50) };
}

export async function run(): Promise<void> {
  let notes = 0;
  let right = 0;
  let extra = 0;
  const errors: number[] = [];
  for (const r of recordings()) {
    const c = compare(r.notes, detectNotes(r.samples, r.rate));
    notes += r.notes.length;
    right += c.right;
    extra += c.extra;
    errors.push(...c.errors);
    if (c.right < r.notes.length || c.extra > 0)
      console.log(`  ${r.name}: ${c.right}/${r.notes.length} at the right pitch, ${c.extra} extra`);
  }
  console.log(
    `pitch: ${right}/${notes} notes at the right pitch (${((100 * right) / notes).toFixed(1)}%, goal >= 97%), ${extra} extra notes`,
  );
  console.log(
    `onset error: p50 ${pct(errors, 50).toFixed(1)} ms, p95 ${pct(errors, 95).toFixed(1)} ms, max ${Math.max(...errors).toFixed(1)} ms (goal p95 <= 25 ms)`,
  );

  const rate = 48000;
  const lines = phrases(rate).map(renderPhrase);
  const all = new Float32Array(lines.reduce((n, l) => n + l.length, 0));
  let at = 0;
  for (const l of lines) {
    all.set(l, at);
    at += l.length;
  }
  const seconds = all.length / rate;
  const whole = timeIt(() => detectNotes(all, rate), 5);
  const blocks = timeIt(() => {
    const d = createNoteDetector(rate);
    for (let i = 0; i < all.length; i += 128) d.push(all.subarray(i, i + 128), (i * 1000) / rate);
    d.flush();
  }, 5);
  const speed = (ms: number) => `${(seconds / (ms / 1000)).toFixed(0)}x`;
  console.log(
    `cost: ${seconds.toFixed(1)} s of 48 kHz audio in ${whole.wall.toFixed(0)} ms whole (${speed(whole.wall)} real time; CPU ${speed(whole.cpu)}), ` +
      `${blocks.wall.toFixed(0)} ms in 128-sample blocks (${speed(blocks.wall)}; CPU ${speed(blocks.cpu)}) (goal >= 30x)`,
  );
}
