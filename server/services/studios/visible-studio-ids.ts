import { eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { studioMembers, studios } from '../../db/schema';

/** The studios a user may see: a teacher's own, a player's memberships, every one for an admin. */
export async function visibleStudioIds(db: Db, user: User): Promise<string[]> {
  if (user.role === 'admin') return (await db.select({ id: studios.id }).from(studios)).map((r) => r.id);
  if (user.role === 'teacher')
    return (await db.select({ id: studios.id }).from(studios).where(eq(studios.teacherId, user.id))).map((r) => r.id);
  const rows = await db
    .select({ id: studioMembers.studioId })
    .from(studioMembers)
    .where(eq(studioMembers.playerId, user.id));
  return rows.map((r) => r.id);
}
