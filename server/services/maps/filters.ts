import { type SQL, sql } from 'drizzle-orm';
import type { MapQuery } from '../../../shared/schemas/maps';

/** The WHERE clause of a map summary table (alias s) for one player and the query's filters. */
export function summaryWhere(playerId: string, q: Omit<MapQuery, 'player'>): SQL {
  const parts: SQL[] = [sql`s.player_id = ${playerId}`, sql`s.notes > 0`];
  if (q.instrument) parts.push(sql`s.instrument = ${q.instrument}`);
  if (q.pattern) parts.push(sql`s.pattern = ${q.pattern}`);
  if (q.pair) parts.push(sql`s.pair = ${q.pair}`);
  if (q.from) parts.push(sql`s.day >= ${q.from}::date`);
  if (q.to) parts.push(sql`s.day <= ${q.to}::date`);
  return sql.join(parts, sql` AND `);
}

export const rate = (errors: number, notes: number) => (notes > 0 ? errors / notes : 0);
