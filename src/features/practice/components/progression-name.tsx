import type { ChordChange } from '@shared/engine';
import type { PitchFrame } from '../lib/pitch-frame';
import { FramedName } from './pitch-label';

/** A progression drill's chords in the player's frame ("over Dm7 G7 Cmaj7"), long ones cut short. */
export function ProgressionName({ changes, frame }: { changes: ChordChange[]; frame: PitchFrame }) {
  const chords = changes.map((c) => c.chord);
  const shown = chords.length > 8 ? chords.slice(0, 8) : chords;
  const more = chords.length > shown.length ? ' …' : '';
  return (
    <span data-testid="progression-name">
      {'over '}
      <FramedName written={shown.map((c) => frame.chord(c)).join(' ') + more} concert={shown.join(' ') + more} />
    </span>
  );
}
