import { and, eq } from 'drizzle-orm';
import type { DrillSpec } from '../../../shared/engine';
import type { SuggestTempoResponse } from '../../../shared/schemas/settings';
import { drillKey, drillShape } from '../../../shared/practice/drill-identity';
import type { Db } from '../../db/client';
import { tempoClimbs } from '../../db/schema/tempo-climbs';

/** The tempo the player has climbed to for this drill in this key, or null before any take. */
export async function suggestTempo(db: Db, playerId: string, spec: DrillSpec): Promise<SuggestTempoResponse['climb']> {
  const [row] = await db
    .select()
    .from(tempoClimbs)
    .where(
      and(
        eq(tempoClimbs.playerId, playerId),
        eq(tempoClimbs.drill, drillShape(spec)),
        eq(tempoClimbs.key, drillKey(spec)),
      ),
    )
    .limit(1);
  return row
    ? {
        tempo: row.tempo,
        lastTempo: row.lastTempo,
        lastVerdict: row.lastVerdict,
        updatedAt: row.updatedAt.toISOString(),
      }
    : null;
}
