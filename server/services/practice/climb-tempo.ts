import { scoringWindows } from '../../../shared/engine';
import { drillShape } from '../../../shared/practice/drill-identity';
import { type ClimbVerdict, climbVerdict, nextTempo } from '../../../shared/practice/tempo-climb';
import type { ScoredTake } from '../takes/score-take';

export interface TempoClimbStep {
  playerId: string;
  drill: string;
  key: string;
  tempo: number;
  lastTempo: number;
  lastVerdict: ClimbVerdict;
}

/**
 * Where the player's tempo for this drill and key goes after a whole timed take: up 4 after a
 * clean one, down 8 after one under 80%. Ladder steps and stopped takes leave it alone (null).
 * The take's own statement stores it (tempo_climbs, one row per player, drill shape and key).
 */
export function tempoClimbStep(playerId: string, scored: ScoredTake, whole: boolean): TempoClimbStep | null {
  if (!whole || scored.options.mode !== 'timed' || scored.expected.length === 0) return null;
  const { hitWindowMs } = scoringWindows(scored.expected, scored.options);
  const played = scored.drill.spec.tempo;
  const take = { accuracy: scored.score.accuracy, meanOffsetMs: scored.score.meanOffsetMs };
  return {
    playerId,
    drill: drillShape(scored.drill.spec),
    key: scored.key,
    tempo: nextTempo(played, take, hitWindowMs),
    lastTempo: played,
    lastVerdict: climbVerdict(take, hitWindowMs),
  };
}
