import { sql } from 'drizzle-orm';
import type { ChartQuery, WeeklyResponse } from '../../../shared/schemas/maps';
import type { Db } from '../../db/client';
import { takeWhere } from './take-where';
import { fillWeeks, recentWeeks } from './weeks';

export const WEEKS_SHOWN = 6;
/** The drills with the most takes in the weeks shown; the rest would crowd the page. */
const MOST_DRILLS = 8;

/**
 * Week over week for each drill (pattern and pair) the player took in the last six weeks: mean
 * accuracy and the fastest tempo per week, weeks starting on Monday in the player's time zone.
 */
export async function weeklyByDrill(
  db: Db,
  playerId: string,
  q: ChartQuery,
  now = new Date(),
): Promise<WeeklyResponse> {
  const weeks = recentWeeks(q.tz, WEEKS_SHOWN, now);
  const { rows } = await db.execute<{
    week: string;
    pattern: string;
    pair: string;
    instrument: string;
    takes: number;
    accuracy: number;
    tempo: number;
  }>(sql`
    SELECT to_char(date_trunc('week', t.started_at AT TIME ZONE ${q.tz})::date, 'YYYY-MM-DD') AS week,
           t.pattern, t.pair, t.instrument,
           count(*)::int AS takes, avg(t.accuracy)::float8 AS accuracy, max(t.tempo)::float8 AS tempo
    FROM takes t
    WHERE ${takeWhere(playerId, q)} AND (t.started_at AT TIME ZONE ${q.tz})::date >= ${weeks[0]}::date
    GROUP BY 1, 2, 3, 4`);
  const groups = new Map<string, typeof rows>();
  for (const r of rows) {
    const id = `${r.pattern}|${r.pair}|${r.instrument}`;
    groups.set(id, [...(groups.get(id) ?? []), r]);
  }
  const drills = [...groups.values()]
    .map((g) => ({
      pattern: g[0].pattern,
      pair: g[0].pair,
      instrument: g[0].instrument,
      total: g.reduce((n, r) => n + r.takes, 0),
      weeks: fillWeeks(weeks, g),
    }))
    .sort((a, b) => b.total - a.total || a.pattern.localeCompare(b.pattern) || a.pair.localeCompare(b.pair))
    .slice(0, MOST_DRILLS)
    .map(({ total: _, ...d }) => d);
  return { weeks, drills };
}
