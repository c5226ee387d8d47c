import { type Drill, type PlayedNote, quarterTempo } from '@shared/engine';
import { Midi } from 'tonal';
import { useCallback, useEffect, useRef, useState } from 'react';

/**
 * Plays a take back over its drill: the drill as written, soft, and what was played on top,
 * from the first downbeat. Tone.js loads only when asked.
 */
export function useTakeReplay(drill: Drill | null, played: PlayedNote[]) {
  const [playing, setPlaying] = useState(false);
  const stopRef = useRef<(() => void) | null>(null);
  const stop = useCallback(() => {
    stopRef.current?.();
    stopRef.current = null;
    setPlaying(false);
  }, []);
  useEffect(() => stop, [stop]);
  const play = useCallback(async () => {
    if (!drill) return;
    stop();
    const Tone = await import('tone');
    await Tone.start();
    const hz = Midi.midiToFreq;
    const written = new Tone.PolySynth(Tone.Synth, { oscillator: { type: 'sine' } }).toDestination();
    written.volume.value = -22;
    const take = new Tone.PolySynth(Tone.Synth, { oscillator: { type: 'triangle' } }).toDestination();
    take.volume.value = -8;
    const t0 = Tone.now() + 0.2;
    const spb = 60 / quarterTempo(drill.spec.tempo, drill.spec.meter);
    for (const n of drill.notes)
      written.triggerAttackRelease(hz(n.midi), n.duration * spb * 0.8, t0 + n.beat * spb, 0.5);
    for (const p of played)
      take.triggerAttackRelease(
        hz(p.midi),
        Math.max(0.08, (p.durationMs ?? 150) / 1000),
        t0 + Math.max(0, p.timeMs) / 1000,
        (p.velocity ?? 90) / 127,
      );
    const endMs = ((drill.notes.at(-1)?.beat ?? 0) + 2) * spb * 1000;
    const timer = setTimeout(() => stop(), endMs);
    stopRef.current = () => {
      clearTimeout(timer);
      written.releaseAll();
      take.releaseAll();
      setTimeout(() => {
        written.dispose();
        take.dispose();
      }, 300);
    };
    setPlaying(true);
  }, [drill, played, stop]);
  return { playing, play, stop };
}
