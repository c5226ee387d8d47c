import { asc, desc, eq, sql } from 'drizzle-orm';
import type { BoardResponse } from '../../../shared/schemas/assignments';
import type { User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { assignments, studioMembers, users } from '../../db/schema';
import { assignmentProgress } from '../assignments/progress';
import { presentAssignment } from '../assignments/present';
import { teacherAccess } from './access';

export const TREND_WEEKS = 6;

/**
 * The studio table for its teacher: players x assignments with each status, each player's last
 * practice and mean accuracy per week over the last six weeks (oldest first).
 */
export async function getStudioBoard(db: Db, teacher: User, studioId: string): Promise<BoardResponse> {
  const { studio } = await teacherAccess(db, teacher, studioId);
  const players = await db
    .select({ id: users.id, name: users.name, email: users.email })
    .from(studioMembers)
    .innerJoin(users, eq(users.id, studioMembers.playerId))
    .where(eq(studioMembers.studioId, studioId))
    .orderBy(asc(users.name));
  const rows = await db
    .select()
    .from(assignments)
    .where(eq(assignments.studioId, studioId))
    .orderBy(desc(assignments.dueAt))
    .limit(12);
  const progress = await assignmentProgress(
    db,
    rows.map((r) => r.id),
  );
  // Week 0 is the last seven days; weeks count back from now, so "this week" is always full.
  const stats = await db.execute<{ player_id: string; week: number; accuracy: number; n: number }>(sql`
    SELECT t.player_id, floor(extract(epoch FROM now() - t.started_at) / 604800)::int AS week,
           avg(t.accuracy)::float8 AS accuracy, count(*)::int AS n
    FROM takes t
    JOIN studio_members m ON m.player_id = t.player_id AND m.studio_id = ${studioId}::uuid
    WHERE t.started_at > now() - make_interval(days => ${TREND_WEEKS * 7})
    GROUP BY 1, 2`);
  const last = await db.execute<{ player_id: string; last: Date | string }>(sql`
    SELECT t.player_id, max(t.started_at) AS last
    FROM takes t JOIN studio_members m ON m.player_id = t.player_id AND m.studio_id = ${studioId}::uuid
    GROUP BY 1`);
  const lastOf = new Map(last.rows.map((r) => [r.player_id, new Date(r.last).toISOString()]));
  return {
    assignments: rows.map((r) =>
      presentAssignment(r, studio.name, progress.get(r.id) ?? [], { id: teacher.id, seesAll: true }),
    ),
    rows: players.map((p) => {
      const trend: (number | null)[] = Array(TREND_WEEKS).fill(null);
      let takesThisWeek = 0;
      for (const s of stats.rows) {
        if (s.player_id !== p.id || s.week < 0 || s.week >= TREND_WEEKS) continue;
        trend[TREND_WEEKS - 1 - s.week] = Math.round(s.accuracy * 1000) / 1000;
        if (s.week === 0) takesThisWeek = s.n;
      }
      const statuses: Record<string, 'open' | 'overdue' | 'met'> = {};
      for (const r of rows) {
        const mine = progress.get(r.id)?.find((x) => x.playerId === p.id);
        if (mine) statuses[r.id] = mine.status;
      }
      return { player: p, lastPracticeAt: lastOf.get(p.id) ?? null, trend, takesThisWeek, statuses };
    }),
  };
}
