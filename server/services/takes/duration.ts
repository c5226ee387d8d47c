import type { DrillNote, PlayedNote } from '../../../shared/engine';

/**
 * How long a take ran, for practice minutes: the later of the scored drill's end and the end of
 * the last note played, cut at the stop point when the player stopped early.
 */
export function takeDurationMs(
  expected: DrillNote[],
  played: PlayedNote[],
  tempo: number,
  stoppedAtMs?: number | null,
): number {
  const msPerBeat = 60000 / tempo;
  let end = 0;
  for (const n of expected) end = Math.max(end, (n.beat + n.duration) * msPerBeat);
  for (const p of played) end = Math.max(end, p.timeMs + (p.durationMs ?? 0));
  if (stoppedAtMs !== undefined && stoppedAtMs !== null) end = Math.min(end, stoppedAtMs);
  return Math.max(0, end);
}
