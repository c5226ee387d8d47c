import { type Drill, sliceDrill } from '@shared/engine';
import { initialLadder, type LadderState, ladderSteps, nextLadderState } from '@shared/practice/ladder';
import { useCallback, useMemo, useState } from 'react';
import type { FinishedTake } from '../lib/take-session';

/**
 * The ladder through a drill's measures: which step is being practised (null when the ladder
 * is off), the passage of the drill it plays, and the next step after each take.
 */
export function useLadder(fullDrill: Drill | null, on: boolean) {
  const [ladder, setLadder] = useState<LadderState>(initialLadder);
  const steps = useMemo(() => (fullDrill ? ladderSteps(fullDrill.measures) : []), [fullDrill]);
  const step = on ? (steps[ladder.step] ?? null) : null;
  const drill = useMemo(
    () => (fullDrill && step ? sliceDrill(fullDrill, step[0], step[1]) : fullDrill),
    [fullDrill, step],
  );
  const restart = useCallback(() => setLadder(initialLadder), []);
  const afterTake = useCallback(
    (take: FinishedTake) => {
      const missed = take.score.results.filter((r) => r.verdict === 'missed').length;
      setLadder((l) => nextLadderState(l, { accuracy: take.score.accuracy, missed }, steps.length));
    },
    [steps.length],
  );
  return { ladder, steps, step, drill, restart, afterTake };
}
