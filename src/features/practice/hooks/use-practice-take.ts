import type { Drill, ScoreOptions } from '@shared/engine';
import { useCallback, useEffect, useRef, useState } from 'react';
import { getNoteInput } from '@/hooks/use-note-input';
import { type ClickMode, startBacking } from '../lib/practice-audio';
import { LiveMarks } from '../lib/live-marks';
import { type FinishedTake, TakeSession } from '../lib/take-session';

export type TakePhase = 'idle' | 'count-in' | 'playing' | 'done';

export interface TakeSetup {
  drill: Drill;
  options: ScoreOptions;
  countInMeasures: number;
  click: ClickMode;
  pad: boolean;
  latencyMs: number;
  volumeDb: number;
}

/**
 * Runs one take at a time: count-in, live marks from the scorer as notes arrive, missed notes
 * as their windows close (a tick every animation frame), and the finished take. The marks live
 * in a small store (LiveMarks) that only the staff and keyboard read.
 */
export function usePracticeTake(onFinished: (take: FinishedTake, session: TakeSession) => void) {
  const [phase, setPhase] = useState<TakePhase>('idle');
  const [live] = useState(() => new LiveMarks());
  const [origin, setOrigin] = useState<number | null>(null);
  const [finished, setFinished] = useState<FinishedTake | null>(null);
  const session = useRef<TakeSession | null>(null);
  const backing = useRef<{ stop(): void } | null>(null);
  const raf = useRef<number | null>(null);
  const onFinishedRef = useRef(onFinished);
  onFinishedRef.current = onFinished;

  const end = useCallback(
    (stoppedAtMs: number | null) => {
      const s = session.current;
      if (!s) return;
      if (raf.current !== null) cancelAnimationFrame(raf.current);
      raf.current = null;
      backing.current?.stop();
      backing.current = null;
      const take = s.finish(stoppedAtMs);
      live.replace(s.marks());
      live.setCurrent(null);
      setFinished(take);
      setPhase('done');
      onFinishedRef.current(take, s);
    },
    [live],
  );

  // Notes from every input go to the running take.
  useEffect(
    () =>
      getNoteInput().onNote((e) => {
        const s = session.current;
        if (!s || s.snapshot().phase === 'done') return;
        if (s.note(e)) live.replace(s.marks());
      }),
    [live],
  );

  const loop = useCallback(() => {
    const s = session.current;
    if (!s) return;
    const { changed, currentChanged, over } = s.frame();
    if (changed) live.replace(s.marks());
    if (currentChanged) live.setCurrent(s.snapshot().current);
    const p = s.snapshot().phase;
    setPhase((old) => (old === p ? old : p));
    if (over) {
      end(null);
      return;
    }
    raf.current = requestAnimationFrame(loop);
  }, [end, live]);

  const start = useCallback(
    (setup: TakeSetup) => {
      if (raf.current !== null) cancelAnimationFrame(raf.current);
      backing.current?.stop();
      const { drill } = setup;
      const measureMs = ((drill.spec.meter[0] * 4) / drill.spec.meter[1]) * (60000 / setup.options.tempo);
      // A short lead before the count-in so its first click is never cut off.
      const lead = 150;
      const s = new TakeSession(drill, setup.options, lead + setup.countInMeasures * measureMs, setup.latencyMs);
      session.current = s;
      setOrigin(s.origin);
      live.reset(drill);
      setFinished(null);
      setPhase(setup.countInMeasures > 0 ? 'count-in' : 'playing');
      startBacking(drill, {
        originPerf: s.origin,
        countInMeasures: setup.countInMeasures,
        click: setup.click,
        pad: setup.pad,
        volumeDb: setup.volumeDb,
      })
        .then((b) => {
          if (session.current === s) backing.current = b;
          else b.stop();
        })
        // No sound device: the take still runs on the screen's count-in.
        .catch(() => undefined);
      raf.current = requestAnimationFrame(loop);
    },
    [loop, live],
  );

  const stop = useCallback(() => {
    const s = session.current;
    if (!s || s.snapshot().phase === 'done') return;
    end(Math.max(0, s.clock()));
  }, [end]);

  const reset = useCallback(() => {
    if (raf.current !== null) cancelAnimationFrame(raf.current);
    raf.current = null;
    backing.current?.stop();
    backing.current = null;
    session.current = null;
    setPhase('idle');
    live.reset();
    setFinished(null);
    setOrigin(null);
  }, [live]);

  useEffect(
    () => () => {
      if (raf.current !== null) cancelAnimationFrame(raf.current);
      backing.current?.stop();
    },
    [],
  );

  return { phase, live, origin, finished, start, stop, reset, session };
}
