import type { DrillSpec, KeyOrder } from '@shared/engine';
import type { PlayerSettings } from '@shared/schemas/settings';
import type { PracticeOptions } from '../components/practice-controls';

/** A practice room's first options: the drill's own values first, the player's defaults for the rest. */
export function initialOptions(
  spec: DrillSpec,
  settings: PlayerSettings,
  order: KeyOrder,
  tempoFromAddress: number | null,
): PracticeOptions {
  return {
    instrument: spec.instrument ?? settings.instrument,
    // An assignment opens at its target tempo; otherwise the drill's own, then the player's.
    tempo: tempoFromAddress ?? spec.tempo ?? settings.defaultTempo,
    meter: spec.meter ?? [4, 4],
    countIn: 1,
    click: 'every-beat',
    swing: 0.5,
    pad: !!(spec.chord || spec.changes),
    octaveTolerant: false,
    mode: 'timed',
    writtenPitchInput: settings.writtenPitchInput,
    loop: false,
    runOn: false,
    order,
    ladder: false,
  };
}
