import { type Drill, scoringWindows, sliceDrill } from '@shared/engine';
import { nextTempo } from '@shared/practice/tempo-climb';
import { useCallback, useMemo, useState } from 'react';
import type { FinishedTake } from '../lib/take-session';

export interface LoopState {
  from: number;
  to: number;
  /** the tempo of the next pass */
  tempo: number;
  /** passes played to the end */
  passes: number;
}

/**
 * A passage looped at its own tempo: measures from..to of the drill, every pass a take of its
 * own, the tempo moved after each pass by the tempo-climb rules and never past the drill's.
 */
export function useLoop(fullDrill: Drill | null, targetTempo: number) {
  const [loop, setLoop] = useState<LoopState | null>(null);

  const drill = useMemo(() => {
    if (!loop || !fullDrill || loop.to > fullDrill.measures) return null;
    const passage = sliceDrill(fullDrill, loop.from, loop.to);
    return { ...passage, spec: { ...passage.spec, tempo: loop.tempo } };
  }, [loop, fullDrill]);

  const start = useCallback(
    (from: number, to: number, tempo: number) => setLoop({ from, to, tempo: Math.min(tempo, targetTempo), passes: 0 }),
    [targetTempo],
  );
  const end = useCallback(() => setLoop(null), []);

  /** After a pass played to the end: the next tempo, climbing toward the drill's own. */
  const afterTake = useCallback(
    (take: FinishedTake) => {
      const hit = scoringWindows(take.drill.notes, take.options).hitWindowMs;
      setLoop((l) =>
        l
          ? {
              ...l,
              passes: l.passes + 1,
              tempo: Math.min(targetTempo, nextTempo(l.tempo, take.score, hit)),
            }
          : l,
      );
    },
    [targetTempo],
  );

  return { loop, drill, start, end, afterTake };
}
