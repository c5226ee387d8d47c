import { sql } from 'drizzle-orm';
import { drillShape } from '../../../shared/practice/drill-identity';
import type { DrillSpec } from '../../../shared/schemas/drills';
import type { AssignmentStatus, PlayerProgress } from '../../../shared/schemas/assignments';
import type { Db } from '../../db/client';

/**
 * The part of a drill's shape an assignment holds a take to: pattern, direction and the pair's
 * shape, not the instrument, so a saxophonist's takes of the drill count as a pianist's do.
 */
export const creditShape = (shape: string | null) =>
  shape === null ? null : shape.split('|').toSpliced(2, 1).join('|');

/** The shape of a stored take's drill from its columns (pair "D/C", pattern name, direction, instrument). */
export function takeShape(t: {
  pair: string;
  pattern: string;
  direction: string;
  instrument: string;
  /** a progression drill's changes and choruses, from the take's spec */
  changes?: DrillSpec['changes'] | null;
  choruses?: number | null;
}): string | null {
  const [a, b] = t.pair.split('/');
  if (!a || !b) return null;
  try {
    return drillShape({
      pair: [a, b],
      pattern: t.pattern as DrillSpec['pattern'],
      direction: t.direction as DrillSpec['direction'],
      instrument: t.instrument as DrillSpec['instrument'],
      ...(t.changes ? { changes: t.changes, choruses: t.choruses ?? undefined } : {}),
    });
  } catch {
    return null;
  }
}

/**
 * Each player's progress with each assignment. A key counts when the player has a take of the
 * same drill (its pattern, direction and the shape of its pair, moved to that key, on any instrument)
 * played whole, at the target tempo or faster and at the target accuracy or better, made after
 * the assignment was set: whatever button started it. The assignment is met when every key it
 * names counts; past its due date and not met, it is overdue; else open. Players are the
 * studio's current members (or `playerId` alone).
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
  // Candidates by key, targets and time in SQL; the same-drill test in TypeScript, where the
  // pair's shape is known. DISTINCT keeps one row per kind of take, not one per take.
  const result = await db.execute<{
    assignment_id: string;
    player_id: string;
    spec: DrillSpec;
    keys: string[];
    past_due: boolean;
    key: string | null;
    pattern: string | null;
    pair: string | null;
    direction: string | null;
    instrument: string | null;
    changes: DrillSpec['changes'] | null;
    choruses: number | null;
  }>(sql`
    SELECT DISTINCT a.id AS assignment_id, m.player_id, a.spec, a.keys, a.due_at < now() AS past_due,
           t.key, t.pattern, t.pair, coalesce(t.spec->>'direction', 'up') AS direction, t.instrument,
           t.spec->'changes' AS changes, (t.spec->>'choruses')::int AS choruses
    FROM assignments a
    JOIN studio_members m ON m.studio_id = a.studio_id
    LEFT JOIN takes t ON t.player_id = m.player_id
                     AND t.key = ANY (a.keys)
                     AND t.tempo >= a.target_tempo
                     AND t.accuracy >= a.target_accuracy
                     AND t.measure_from IS NULL
                     AND t.created_at > a.created_at
    WHERE a.id IN (${ids}) ${playerId ? sql`AND m.player_id = ${playerId}::uuid` : sql``}`);
  const shapes = new Map<string, string>();
  const rows = new Map<
    string,
    { assignmentId: string; playerId: string; keys: string[]; pastDue: boolean; met: Set<string> }
  >();
  for (const r of result.rows) {
    const id = `${r.assignment_id}|${r.player_id}`;
    let row = rows.get(id);
    if (!row) {
      row = { assignmentId: r.assignment_id, playerId: r.player_id, keys: r.keys, pastDue: r.past_due, met: new Set() };
      rows.set(id, row);
    }
    if (!r.key || !r.pair || !r.pattern || !r.instrument || !r.direction) continue;
    let want = shapes.get(r.assignment_id);
    if (want === undefined) {
      want = creditShape(drillShape({ ...r.spec, pattern: r.spec.pattern as DrillSpec['pattern'] })) ?? '';
      shapes.set(r.assignment_id, want);
    }
    const shape = creditShape(
      takeShape({
        pair: r.pair,
        pattern: r.pattern,
        direction: r.direction,
        instrument: r.instrument,
        changes: r.changes,
        choruses: r.choruses,
      }),
    );
    if (shape === want) row.met.add(r.key);
  }
  for (const row of rows.values()) {
    const met = row.keys.every((k) => row.met.has(k));
    const status: AssignmentStatus = met ? 'met' : row.pastDue ? 'overdue' : 'open';
    byAssignment.get(row.assignmentId)?.push({ playerId: row.playerId, status, keysMet: [...row.met].sort() });
  }
  return byAssignment;
}
