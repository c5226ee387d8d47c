import { sql } from 'drizzle-orm';
import type { MapQuery, RangeCell } from '../../../shared/schemas/maps';
import type { Db } from '../../db/client';
import { rate, summaryWhere } from './filters';

/**
 * Error rate per concert pitch, low to high. Without days it reads the all-time totals (a few
 * thousand rows at most); with them, the daily summary.
 */
export async function rangeMap(db: Db, playerId: string, q: MapQuery): Promise<RangeCell[]> {
  const table = q.from || q.to ? sql`map_range_days` : sql`map_range_totals`;
  const { rows } = await db.execute<{ midi: number; notes: number; errors: number }>(sql`
    SELECT s.midi::int AS midi, sum(s.notes)::int AS notes, sum(s.errors)::int AS errors
    FROM ${table} s WHERE ${summaryWhere(playerId, q)}
    GROUP BY s.midi ORDER BY s.midi`);
  return rows.map((r) => ({ midi: r.midi, notes: r.notes, errors: r.errors, rate: rate(r.errors, r.notes) }));
}
