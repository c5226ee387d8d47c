import { useEffect, useRef, useState } from 'react';
import { getNoteInput } from '@/hooks/use-note-input';
import { sendNote } from '@/lib/midi-output';
import type { HearSettings } from '../components/hear-yourself';
import { PlayedSynth } from '../lib/practice-audio';

/**
 * Where the notes a player plays are heard: the page's own synth (volume, mute, breath) or a
 * MIDI output the player picked. Returns the settings, their setter and the synth (the take
 * wakes it, since browsers start sound only after a click).
 */
export function useSoundRouting() {
  const [hear, setHear] = useState<HearSettings>({ volumeDb: -10, muted: false, outputId: null });
  const synth = useRef(new PlayedSynth());

  useEffect(() => {
    synth.current.setVolume(hear.volumeDb);
    synth.current.setMuted(hear.muted || hear.outputId !== null);
  }, [hear]);

  useEffect(() => {
    const offNote = getNoteInput().onNote((e) => {
      // An acoustic instrument is heard already, and the microphone would hear the echo.
      if (e.source === 'mic') return;
      if (hear.outputId) sendNote(hear.outputId, e.type, e.midi, e.velocity);
      // The synth starts as soon as the input's other listeners are done (a microtask, in the
      // same task): the take paints the note's mark first, and the sound follows well under a
      // millisecond later.
      else if (e.type === 'on')
        queueMicrotask(() => {
          void synth.current.ensure();
          synth.current.noteOn(e.midi, e.velocity);
        });
      else queueMicrotask(() => synth.current.noteOff(e.midi));
    });
    const offBreath = getNoteInput().onBreath((v) => synth.current.breath(v));
    return () => {
      offNote();
      offBreath();
    };
  }, [hear.outputId]);

  return { hear, setHear, synth: synth.current };
}
