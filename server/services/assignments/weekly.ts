import { asc, eq, sql } from 'drizzle-orm';
import { drillShape } from '../../../shared/practice/drill-identity';
import type { AssignmentWeeklyResponse } from '../../../shared/schemas/assignments';
import type { User } from '../../../shared/schemas/auth';
import type { DrillSpec } from '../../../shared/schemas/drills';
import type { Db } from '../../db/client';
import { assignments, studioMembers, users } from '../../db/schema';
import { notFound } from '../../errors';
import { isId } from '../drills/visible-owner-ids';
import { WEEKS_SHOWN } from '../maps/weekly';
import { fillWeeks, recentWeeks } from '../maps/weeks';
import { studioAccess } from '../studios/access';
import { creditShape, takeShape } from './progress';

/**
 * Week over week for one assignment: each player's whole takes of its drill in any of its keys
 * (whatever started them), mean accuracy and fastest tempo per week. Its teacher sees every
 * player of the studio; a player only themselves.
 */
export async function assignmentWeekly(
  db: Db,
  user: User,
  id: string,
  tz: string,
  now = new Date(),
): Promise<AssignmentWeeklyResponse> {
  if (!isId(id)) throw notFound('That assignment');
  const [a] = await db.select().from(assignments).where(eq(assignments.id, id)).limit(1);
  if (!a) throw notFound('That assignment');
  const { role } = await studioAccess(db, user, a.studioId);
  const members = await db
    .select({ id: users.id, name: users.name })
    .from(studioMembers)
    .innerJoin(users, eq(users.id, studioMembers.playerId))
    .where(eq(studioMembers.studioId, a.studioId))
    .orderBy(asc(users.name));
  const shown = role === 'player' ? members.filter((m) => m.id === user.id) : members;
  const weeks = recentWeeks(tz, WEEKS_SHOWN, now);
  if (shown.length === 0) return { weeks, players: [] };
  const ids = sql.join(
    shown.map((m) => sql`${m.id}::uuid`),
    sql`, `,
  );
  const { rows } = await db.execute<{
    player_id: string;
    week: string;
    pattern: string;
    pair: string;
    instrument: string;
    direction: string;
    changes: DrillSpec['changes'] | null;
    choruses: number | null;
    takes: number;
    accuracy: number;
    tempo: number;
  }>(sql`
    SELECT t.player_id, to_char(date_trunc('week', t.started_at AT TIME ZONE ${tz})::date, 'YYYY-MM-DD') AS week,
           t.pattern, t.pair, t.instrument, coalesce(t.spec->>'direction', 'up') AS direction,
           t.spec->'changes' AS changes, (t.spec->>'choruses')::int AS choruses,
           count(*)::int AS takes, avg(t.accuracy)::float8 AS accuracy, max(t.tempo)::float8 AS tempo
    FROM takes t
    WHERE t.player_id IN (${ids}) AND t.key = ANY (SELECT unnest(keys) FROM assignments WHERE id = ${a.id}::uuid) AND t.measure_from IS NULL
      AND (t.started_at AT TIME ZONE ${tz})::date >= ${weeks[0]}::date
    GROUP BY 1, 2, 3, 4, 5, 6, 7, 8`);
  const want = creditShape(drillShape(a.spec as DrillSpec));
  // Merge the pairs of one week (each key is its own pair): accuracy weighted by takes.
  const merged = new Map<string, { week: string; takes: number; accuracy: number; tempo: number }[]>();
  for (const r of rows) {
    if (creditShape(takeShape(r)) !== want) continue;
    const list = merged.get(r.player_id) ?? [];
    const w = list.find((x) => x.week === r.week);
    if (w) {
      w.accuracy = (w.accuracy * w.takes + r.accuracy * r.takes) / (w.takes + r.takes);
      w.takes += r.takes;
      w.tempo = Math.max(w.tempo, r.tempo);
    } else list.push({ week: r.week, takes: r.takes, accuracy: r.accuracy, tempo: r.tempo });
    merged.set(r.player_id, list);
  }
  return {
    weeks,
    players: shown.map((m) => ({ playerId: m.id, name: m.name, weeks: fillWeeks(weeks, merged.get(m.id) ?? []) })),
  };
}
