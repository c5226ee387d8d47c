import { asc, desc, eq, inArray } from 'drizzle-orm';
import type { Assignment } from '../../../shared/schemas/assignments';
import type { User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { assignments, studioMembers, studios } from '../../db/schema';
import { studioAccess } from '../studios/access';
import { assignmentProgress } from './progress';
import { presentAssignment } from './present';

/** A studio's assignments, latest due first: every player's progress for the teacher, one's own for a player. */
export async function listStudioAssignments(db: Db, user: User, studioId: string): Promise<Assignment[]> {
  const { studio, role } = await studioAccess(db, user, studioId);
  const rows = await db
    .select()
    .from(assignments)
    .where(eq(assignments.studioId, studioId))
    .orderBy(desc(assignments.dueAt), desc(assignments.createdAt));
  const seesAll = role !== 'player';
  const progress = await assignmentProgress(
    db,
    rows.map((r) => r.id),
    seesAll ? undefined : user.id,
  );
  return rows.map((r) => presentAssignment(r, studio.name, progress.get(r.id) ?? [], { id: user.id, seesAll }));
}

/** A player's assignments across all their studios, due soonest first, with their own status. */
export async function listMyAssignments(db: Db, player: User): Promise<Assignment[]> {
  const mine = await db
    .select({ id: studios.id, name: studios.name })
    .from(studioMembers)
    .innerJoin(studios, eq(studios.id, studioMembers.studioId))
    .where(eq(studioMembers.playerId, player.id));
  if (mine.length === 0) return [];
  const names = new Map(mine.map((s) => [s.id, s.name]));
  const rows = await db
    .select()
    .from(assignments)
    .where(
      inArray(
        assignments.studioId,
        mine.map((s) => s.id),
      ),
    )
    .orderBy(asc(assignments.dueAt));
  const progress = await assignmentProgress(
    db,
    rows.map((r) => r.id),
    player.id,
  );
  return rows.map((r) =>
    presentAssignment(r, names.get(r.studioId) ?? '', progress.get(r.id) ?? [], { id: player.id, seesAll: false }),
  );
}
