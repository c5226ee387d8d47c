import { and, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { studioMembers, studios } from '../../db/schema/studios';
import type { TakeRow } from '../../db/schema/takes';
import { notFound } from '../../errors';

/**
 * A take the viewer may see: their own, or (for a teacher) one by a player of a studio they
 * teach. Anything else is "not found", so its existence is not revealed.
 */
export async function getTake(db: Db, viewer: { id: string; role: string }, takeId: string): Promise<TakeRow> {
  const take = await db.query.takes.findFirst({ where: (t, { eq }) => eq(t.id, takeId) });
  if (!take) throw notFound('That take');
  if (take.playerId === viewer.id) return take;
  if (viewer.role === 'teacher' && (await teachesPlayer(db, viewer.id, take.playerId))) return take;
  throw notFound('That take');
}

export async function teachesPlayer(db: Db, teacherId: string, playerId: string): Promise<boolean> {
  const rows = await db
    .select({ one: studioMembers.playerId })
    .from(studioMembers)
    .innerJoin(studios, eq(studios.id, studioMembers.studioId))
    .where(and(eq(studios.teacherId, teacherId), eq(studioMembers.playerId, playerId)))
    .limit(1);
  return rows.length > 0;
}
