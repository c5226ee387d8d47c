import type { Drill, PlayedNote } from '@shared/engine';
import { useCallback, useEffect, useRef, useState } from 'react';
import { type Replay, replayTake } from '@/lib/audio/replay';

/**
 * Plays a take back over its drill (the shared replay: one at a time, Tone.js loaded only when
 * asked), with whether it is playing now for the button.
 */
export function useTakeReplay(drill: Drill | null, played: PlayedNote[]) {
  const [playing, setPlaying] = useState(false);
  const mine = useRef<Replay | null>(null);
  const stop = useCallback(() => {
    mine.current?.stop();
    mine.current = null;
    setPlaying(false);
  }, []);
  useEffect(() => stop, [stop]);
  const play = useCallback(async () => {
    if (!drill) return;
    const replay = replayTake(drill, played, {
      onEnd: () => {
        if (mine.current === replay) mine.current = null;
        setPlaying(false);
      },
    });
    mine.current = replay;
    setPlaying(true);
    // No sound device: the replay has stopped itself, and the button reads Replay again.
    await replay.ready.catch(() => undefined);
  }, [drill, played]);
  return { playing, play, stop };
}
