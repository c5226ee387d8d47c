import { sql } from 'drizzle-orm';
import type { AssignmentStatus, PlayerProgress } from '../../../shared/schemas/assignments';
import type { Db } from '../../db/client';

/**
 * Each player's progress with each assignment, computed in SQL. An assignment is met when
 * every key it names has a take made from it (its assignmentId) at or above the target tempo
 * and accuracy, made after the assignment was set; past its due date and not met, it is
 * overdue; else open. Players are the studio's current members (or `playerId` alone).
 */
export async function assignmentProgress(
  db: Db,
  assignmentIds: string[],
  playerId?: string,
): Promise<Map<string, PlayerProgress[]>> {
  const byAssignment = new Map<string, PlayerProgress[]>(assignmentIds.map((id) => [id, []]));
  if (assignmentIds.length === 0) return byAssignment;
  const ids = sql.join(
    assignmentIds.map((id) => sql`${id}::uuid`),
    sql`, `,
  );
  const result = await db.execute<{
    assignment_id: string;
    player_id: string;
    keys_met: string[];
    met: boolean;
    past_due: boolean;
  }>(sql`
    SELECT a.id AS assignment_id, m.player_id,
           coalesce(array_agg(DISTINCT t.key) FILTER (WHERE t.key IS NOT NULL), '{}'::text[]) AS keys_met,
           a.keys <@ coalesce(array_agg(DISTINCT t.key) FILTER (WHERE t.key IS NOT NULL), '{}'::text[]) AS met,
           a.due_at < now() AS past_due
    FROM assignments a
    JOIN studio_members m ON m.studio_id = a.studio_id
    LEFT JOIN takes t ON t.assignment_id = a.id
                     AND t.player_id = m.player_id
                     AND t.key = ANY (a.keys)
                     AND t.tempo >= a.target_tempo
                     AND t.accuracy >= a.target_accuracy
                     AND t.created_at > a.created_at
    WHERE a.id IN (${ids}) ${playerId ? sql`AND m.player_id = ${playerId}::uuid` : sql``}
    GROUP BY a.id, m.player_id`);
  for (const r of result.rows) {
    const status: AssignmentStatus = r.met ? 'met' : r.past_due ? 'overdue' : 'open';
    byAssignment.get(r.assignment_id)?.push({ playerId: r.player_id, status, keysMet: [...r.keys_met].sort() });
  }
  return byAssignment;
}
