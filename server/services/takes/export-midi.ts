import { generateDrill, sliceDrill, takeToMidi } from '../../../shared/engine';
import type { TakeRow } from '../../db/schema/takes';

/** The take as a Standard MIDI File: a "Drill" track as written and a "Take" track as played. */
export function exportTakeMidi(take: TakeRow): Uint8Array {
  let drill = generateDrill(take.spec);
  if (take.measureFrom !== null && take.measureTo !== null) drill = sliceDrill(drill, take.measureFrom, take.measureTo);
  return takeToMidi({ drill, played: take.played });
}

export function takeFileName(take: TakeRow): string {
  const safe = (s: string) => s.replace(/[^A-Za-z0-9#-]+/g, '-').replace(/#/g, 's');
  return `sixfold-take-${safe(take.pair)}-${safe(take.pattern)}-${take.startedAt.toISOString().slice(0, 10)}.mid`;
}
