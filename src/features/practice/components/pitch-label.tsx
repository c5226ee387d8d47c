import { keyLabel } from '@/components/midi/keyboard-diagram';
import type { PitchFrame } from '../lib/pitch-frame';

/** A concert MIDI note named in the player's frame, with its concert name in small type when they differ. */
export function PitchLabel({ frame, midi }: { frame: PitchFrame; midi: number }) {
  const written = frame.name(frame.written(midi));
  if (!frame.transposing) return <>{written}</>;
  return (
    <>
      {written} <small className="font-normal text-muted">(concert {keyLabel(midi)})</small>
    </>
  );
}

/** A key or chord named in the player's frame, with the concert name in small type when they differ. */
export function FramedName({ written, concert }: { written: string; concert: string }) {
  if (written === concert) return <>{written}</>;
  return (
    <>
      {written} <small className="font-normal text-muted">(concert {concert})</small>
    </>
  );
}
