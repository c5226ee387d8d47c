import { sql } from 'drizzle-orm';
import type { BeatCell, MapQuery } from '../../../shared/schemas/maps';
import type { Db } from '../../db/client';
import { rate, summaryWhere } from './filters';

/** Error rate by position in the bar (beatInMeasure to 1/12 of a beat), per meter. */
export async function beatMap(db: Db, playerId: string, q: MapQuery): Promise<BeatCell[]> {
  const { rows } = await db.execute<{ meter: string; position: number; notes: number; errors: number }>(sql`
    SELECT s.meter, s.position::float8 AS position, sum(s.notes)::int AS notes, sum(s.errors)::int AS errors
    FROM map_beat_days s WHERE ${summaryWhere(playerId, q)}
    GROUP BY s.meter, s.position ORDER BY s.meter, s.position`);
  // real -> float8 shows 4.5833335; the stored value is a twelfth rounded to single precision.
  return rows.map((r) => ({
    meter: r.meter,
    position: Math.round(r.position * 12) / 12,
    notes: r.notes,
    errors: r.errors,
    rate: rate(r.errors, r.notes),
  }));
}
