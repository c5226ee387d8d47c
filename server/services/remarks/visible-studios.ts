import { and, asc, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { studioMembers, studios } from '../../db/schema';

/** The studios a teacher teaches that the player belongs to, oldest first. */
export async function sharedStudioIds(db: Db, teacherId: string, playerId: string): Promise<string[]> {
  const rows = await db
    .select({ id: studios.id })
    .from(studios)
    .innerJoin(studioMembers, eq(studioMembers.studioId, studios.id))
    .where(and(eq(studios.teacherId, teacherId), eq(studioMembers.playerId, playerId)))
    .orderBy(asc(studios.createdAt));
  return rows.map((r) => r.id);
}
