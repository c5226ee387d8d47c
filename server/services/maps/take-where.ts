import { type SQL, sql } from 'drizzle-orm';
import type { TakeFilters } from '../../../shared/schemas/history';

/** The WHERE clause over takes (alias t) for one player and the filters; days are UTC days. */
export function takeWhere(playerId: string, q: Omit<TakeFilters, 'player'>): SQL {
  const parts: SQL[] = [sql`t.player_id = ${playerId}`];
  if (q.key) parts.push(sql`t.key = ${q.key}`);
  if (q.pattern) parts.push(sql`t.pattern = ${q.pattern}`);
  if (q.instrument) parts.push(sql`t.instrument = ${q.instrument}`);
  if (q.pair) parts.push(sql`t.pair = ${q.pair}`);
  if (q.from) parts.push(sql`t.started_at >= (${q.from}::date)::timestamp AT TIME ZONE 'UTC'`);
  if (q.to) parts.push(sql`t.started_at < (${q.to}::date + 1)::timestamp AT TIME ZONE 'UTC'`);
  return sql.join(parts, sql` AND `);
}
