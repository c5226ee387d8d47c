/**
 * Tempo climb: a clean take (accuracy >= 95% and |mean offset| within the hit window) raises the
 * tempo 4 bpm; a take under 80% lowers it 8; anything between keeps it.
 *
 * @example
 * nextTempo(100, { accuracy: 0.97, meanOffsetMs: 12 }, 60) // 104
 */
export const CLIMB = { cleanAccuracy: 0.95, messyAccuracy: 0.8, up: 4, down: 8, min: 30, max: 320 } as const;

export type ClimbVerdict = 'up' | 'down' | 'hold';

export function climbVerdict(
  take: { accuracy: number; meanOffsetMs: number | null },
  hitWindowMs: number,
): ClimbVerdict {
  if (take.accuracy >= CLIMB.cleanAccuracy && take.meanOffsetMs !== null && Math.abs(take.meanOffsetMs) <= hitWindowMs)
    return 'up';
  if (take.accuracy < CLIMB.messyAccuracy) return 'down';
  return 'hold';
}

export function nextTempo(
  tempo: number,
  take: { accuracy: number; meanOffsetMs: number | null },
  hitWindowMs: number,
): number {
  const verdict = climbVerdict(take, hitWindowMs);
  const next = verdict === 'up' ? tempo + CLIMB.up : verdict === 'down' ? tempo - CLIMB.down : tempo;
  return Math.min(CLIMB.max, Math.max(CLIMB.min, next));
}

/** The default hit window of the scorer at a tempo: min(90, max(35, beat ms / 8)). */
export function defaultHitWindowMs(tempo: number): number {
  return Math.min(90, Math.max(35, 60000 / tempo / 8));
}
