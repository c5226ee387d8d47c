import { eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { studioMembers, studios } from '../../db/schema';

/** Whose saved drills and patterns a user may read: their own, and their studios' teachers'. */
export async function visibleOwnerIds(db: Db, user: User): Promise<string[]> {
  const rows = await db
    .select({ teacherId: studios.teacherId })
    .from(studioMembers)
    .innerJoin(studios, eq(studios.id, studioMembers.studioId))
    .where(eq(studioMembers.playerId, user.id));
  return [...new Set([user.id, ...rows.map((r) => r.teacherId)])];
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** An id Sixfold could have given out; anything else is simply not found. */
export const isId = (id: string) => UUID.test(id);
