import type { DrillSpec, ScoreOptions } from '@shared/engine';
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useState } from 'react';
import { tempoKeys } from '@/lib/queries/keys';
import { dismissRefused, onQueueChange, type QueueState, saveTake } from '@/lib/take-queue';
import type { FinishedTake } from '../lib/take-session';

export interface TakeToSave {
  /** the whole drill the take belongs to, at the take's tempo (a ladder step or a loop pass is a passage of it) */
  spec: DrillSpec;
  take: FinishedTake;
  options: ScoreOptions;
  /** the take session's performance.now() origin, turned into the take's wall-clock start */
  originPerf: number;
  measures: [number, number] | null;
  assignmentId: string | null;
}

/**
 * The takes waiting on this device to reach the server, and the one way the practice room
 * saves a take: into the device's queue first, then the tempo climb is asked again.
 */
export function useTakeQueue() {
  const queryClient = useQueryClient();
  const [queue, setQueue] = useState<QueueState>({ waiting: 0, refused: [], busy: false });
  useEffect(() => onQueueChange(setQueue), []);

  const save = useCallback(
    ({ spec, take, options, originPerf, measures, assignmentId }: TakeToSave) => {
      const startedAt = new Date(Date.now() - (performance.now() - originPerf)).toISOString();
      return saveTake({
        id: crypto.randomUUID(),
        spec,
        played: take.played,
        options,
        startedAt,
        measures,
        stoppedAtMs: take.stoppedAtMs,
        inputKind: take.inputKind,
        assignmentId,
      }).then(() => queryClient.invalidateQueries({ queryKey: tempoKeys.forSpec(spec) }));
    },
    [queryClient],
  );

  /** Lets the player put away a refused take once they have read why (it leaves the device). */
  const dismiss = useCallback((id: string) => dismissRefused(id), []);

  return { queue, save, dismiss };
}
