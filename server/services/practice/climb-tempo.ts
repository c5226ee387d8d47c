import { sql } from 'drizzle-orm';
import { scoringWindows } from '../../../shared/engine';
import { drillShape } from '../../../shared/practice/drill-identity';
import { climbVerdict, nextTempo } from '../../../shared/practice/tempo-climb';
import type { Db } from '../../db/client';
import { tempoClimbs } from '../../db/schema/tempo-climbs';
import type { ScoredTake } from '../takes/score-take';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/**
 * Moves the player's tempo for this drill and key after a whole timed take: up 4 after a clean
 * one, down 8 after one under 80%. Ladder steps and stopped takes leave it alone.
 */
export async function climbTempo(tx: Tx, playerId: string, scored: ScoredTake, whole: boolean): Promise<void> {
  if (!whole || scored.options.mode !== 'timed' || scored.expected.length === 0) return;
  const { hitWindowMs } = scoringWindows(scored.expected, scored.options);
  const played = scored.drill.spec.tempo;
  const take = { accuracy: scored.score.accuracy, meanOffsetMs: scored.score.meanOffsetMs };
  const tempo = nextTempo(played, take, hitWindowMs);
  const verdict = climbVerdict(take, hitWindowMs);
  await tx
    .insert(tempoClimbs)
    .values({
      playerId,
      drill: drillShape(scored.drill.spec),
      key: scored.key,
      tempo,
      lastTempo: played,
      lastVerdict: verdict,
    })
    .onConflictDoUpdate({
      target: [tempoClimbs.playerId, tempoClimbs.drill, tempoClimbs.key],
      set: { tempo, lastTempo: played, lastVerdict: verdict, updatedAt: sql`now()` },
    });
}
