import { sql } from 'drizzle-orm';
import type { KeyCell, MapQuery } from '../../../shared/schemas/maps';
import { KEYS } from '../../../shared/schemas/history';
import type { Db } from '../../db/client';
import { rate, summaryWhere } from './filters';

/** Error rate per key x pattern, from the per-day summaries; keys in C Db D ... B order. */
export async function keyMap(db: Db, playerId: string, q: MapQuery): Promise<KeyCell[]> {
  const { rows } = await db.execute<{ key: string; pattern: string; notes: number; errors: number }>(sql`
    SELECT s.key, s.pattern, sum(s.notes)::int AS notes, sum(s.errors)::int AS errors
    FROM map_key_days s WHERE ${summaryWhere(playerId, q)}
    GROUP BY s.key, s.pattern`);
  const order = (k: string) => (KEYS as readonly string[]).indexOf(k);
  return rows
    .map((r) => ({ key: r.key, pattern: r.pattern, notes: r.notes, errors: r.errors, rate: rate(r.errors, r.notes) }))
    .sort((a, b) => a.pattern.localeCompare(b.pattern) || order(a.key) - order(b.key));
}
