import { type Drill, type PlayedNote, quarterTempo } from '@shared/engine';
import { Midi } from 'tonal';

/** Plays the take back: what was played (lead) over the drill as written (soft), from the downbeat. */
export async function replayTake(
  drill: Drill,
  played: PlayedNote[],
  onTime?: (ms: number) => void,
): Promise<{ stop(): void }> {
  const Tone = await import('tone');
  await Tone.start();
  const hz = Midi.midiToFreq;
  const lead = new Tone.PolySynth(Tone.Synth, { oscillator: { type: 'triangle' } }).toDestination();
  lead.volume.value = -8;
  const guide = new Tone.PolySynth(Tone.Synth, { oscillator: { type: 'sine' } }).toDestination();
  guide.volume.value = -24;
  const t0 = Tone.now() + 0.2;
  const spb = 60 / quarterTempo(drill.spec.tempo, drill.spec.meter);
  for (const n of drill.notes) guide.triggerAttackRelease(hz(n.midi), n.duration * spb * 0.8, t0 + n.beat * spb, 0.5);
  for (const p of played) {
    const at = t0 + Math.max(0, p.timeMs) / 1000;
    lead.triggerAttackRelease(hz(p.midi), Math.max(0.08, (p.durationMs ?? 150) / 1000), at, (p.velocity ?? 90) / 127);
  }
  const started = performance.now() + 200;
  let raf = 0;
  const tick = () => {
    onTime?.(performance.now() - started);
    raf = requestAnimationFrame(tick);
  };
  if (onTime) raf = requestAnimationFrame(tick);
  const last = Math.max(drill.notes.at(-1)?.beat ?? 0, 0) * spb * 1000;
  const endTimer = setTimeout(() => stop(), last + 1500);
  function stop() {
    cancelAnimationFrame(raf);
    clearTimeout(endTimer);
    lead.releaseAll();
    guide.releaseAll();
    setTimeout(() => {
      lead.dispose();
      guide.dispose();
    }, 400);
  }
  return { stop };
}
