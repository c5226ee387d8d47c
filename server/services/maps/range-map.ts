import { sql } from 'drizzle-orm';
import type { MapQuery, RangeCell } from '../../../shared/schemas/maps';
import type { Db } from '../../db/client';
import { rate, summaryWhere } from './filters';

/** Error rate per concert pitch, low to high. */
export async function rangeMap(db: Db, playerId: string, q: MapQuery): Promise<RangeCell[]> {
  const { rows } = await db.execute<{ midi: number; notes: number; errors: number }>(sql`
    SELECT s.midi::int AS midi, sum(s.notes)::int AS notes, sum(s.errors)::int AS errors
    FROM map_range_days s WHERE ${summaryWhere(playerId, q)}
    GROUP BY s.midi ORDER BY s.midi`);
  return rows.map((r) => ({ midi: r.midi, notes: r.notes, errors: r.errors, rate: rate(r.errors, r.notes) }));
}
