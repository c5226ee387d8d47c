import type { Drill, PlayedNote } from '@shared/engine';
import { useCallback, useEffect, useRef } from 'react';
import { type Replay, replayTake } from '@/lib/audio/replay';

/**
 * Replays a finished take over its drill. One replay at a time (starting one stops the one
 * before, also while it is still loading), and leaving the page stops this page's replay.
 */
export function useReplay() {
  const mine = useRef<Replay | null>(null);

  const stop = useCallback(() => {
    mine.current?.stop();
    mine.current = null;
  }, []);

  const play = useCallback((drill: Drill, played: PlayedNote[]) => {
    const replay = replayTake(drill, played);
    mine.current = replay;
    // No sound device: nothing to replay, and nothing to stop later.
    replay.ready.catch(() => {
      if (mine.current === replay) mine.current = null;
    });
  }, []);

  useEffect(() => stop, [stop]);
  return { play, stop };
}
