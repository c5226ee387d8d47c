import type { Drill, PlayedNote } from '@shared/engine';
import { useCallback, useEffect, useRef } from 'react';
import { replayTake } from '../lib/replay';

/**
 * One replay at a time: starting a replay stops the one before it (also when it is still
 * loading), and leaving the page stops whatever is playing.
 */
export function useReplay() {
  const playing = useRef<Promise<{ stop(): void }> | null>(null);

  const stop = useCallback(() => {
    const prev = playing.current;
    playing.current = null;
    void prev?.then((r) => r.stop()).catch(() => undefined);
  }, []);

  const play = useCallback(
    (drill: Drill, played: PlayedNote[]) => {
      stop();
      const next = replayTake(drill, played);
      playing.current = next;
      // No sound device: nothing to replay, and nothing to stop later.
      next.catch(() => {
        if (playing.current === next) playing.current = null;
      });
    },
    [stop],
  );

  useEffect(() => stop, [stop]);
  return { play, stop };
}
