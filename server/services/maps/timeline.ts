import { sql } from 'drizzle-orm';
import type { ChartQuery, TimelinePoint } from '../../../shared/schemas/maps';
import type { Db } from '../../db/client';
import { takeWhere } from './take-where';

/** Accuracy (mean) and tempo (highest) per day and key, days in the player's time zone. */
export async function timeline(db: Db, playerId: string, q: ChartQuery): Promise<TimelinePoint[]> {
  const { rows } = await db.execute<TimelinePoint>(sql`
    SELECT to_char((t.started_at AT TIME ZONE ${q.tz})::date, 'YYYY-MM-DD') AS day, t.key,
           count(*)::int AS takes, avg(t.accuracy)::float8 AS accuracy, max(t.tempo)::float8 AS tempo
    FROM takes t WHERE ${takeWhere(playerId, q)}
    GROUP BY 1, 2 ORDER BY 1, 2`);
  return rows;
}
