import { and, desc, eq, sql } from 'drizzle-orm';
import type { StudioPlayerResponse } from '../../../shared/schemas/assignments';
import type { User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { takes, users } from '../../db/schema';
import { listStudioAssignments } from '../assignments/list';
import { assertStudioPlayer, teacherAccess } from './access';

/** One player of the studio as the teacher reviews them: latest takes, and each assignment's status. */
export async function getStudioPlayer(
  db: Db,
  teacher: User,
  studioId: string,
  playerId: string,
): Promise<StudioPlayerResponse> {
  await teacherAccess(db, teacher, studioId);
  await assertStudioPlayer(db, studioId, playerId);
  const [player] = await db
    .select({ id: users.id, name: users.name, email: users.email })
    .from(users)
    .where(eq(users.id, playerId));
  const rows = await db
    .select({
      id: takes.id,
      assignmentId: takes.assignmentId,
      key: takes.key,
      pattern: takes.pattern,
      pair: takes.pair,
      tempo: takes.tempo,
      accuracy: takes.accuracy,
      startedAt: takes.startedAt,
      remarkCount: sql<number>`(SELECT count(*)::int FROM remarks r WHERE r.take_id = "takes"."id" AND r.studio_id = ${studioId}::uuid)`,
    })
    .from(takes)
    .where(and(eq(takes.playerId, playerId)))
    .orderBy(desc(takes.startedAt))
    .limit(60);
  const assignments = (await listStudioAssignments(db, teacher, studioId)).map((a) => {
    const mine = a.players?.find((p) => p.playerId === playerId);
    return { ...a, players: undefined, status: mine?.status ?? null, keysMet: mine?.keysMet ?? [] };
  });
  return { player, takes: rows.map((r) => ({ ...r, startedAt: r.startedAt.toISOString() })), assignments };
}
