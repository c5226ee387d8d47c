import { and, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { StudioRole } from '../../../shared/schemas/studios';
import type { Db } from '../../db/client';
import { studioMembers, studios } from '../../db/schema';
import { forbidden, notFound } from '../../errors';
import { isId } from '../drills/visible-owner-ids';

export interface StudioAccess {
  studio: { id: string; name: string; teacherId: string };
  role: StudioRole;
}

/**
 * What the user is in the studio. Anyone outside it gets the same 404 as for a studio that
 * does not exist, so another teacher's studio is never revealed.
 */
export async function studioAccess(db: Db, user: User, studioId: string): Promise<StudioAccess> {
  if (!isId(studioId)) throw notFound('That studio');
  const [studio] = await db
    .select({ id: studios.id, name: studios.name, teacherId: studios.teacherId })
    .from(studios)
    .where(eq(studios.id, studioId))
    .limit(1);
  if (!studio) throw notFound('That studio');
  if (user.role === 'admin') return { studio, role: 'admin' };
  if (studio.teacherId === user.id) return { studio, role: 'teacher' };
  const [member] = await db
    .select({ id: studioMembers.playerId })
    .from(studioMembers)
    .where(and(eq(studioMembers.studioId, studioId), eq(studioMembers.playerId, user.id)))
    .limit(1);
  if (member) return { studio, role: 'player' };
  throw notFound('That studio');
}

/** The studio's teacher (or an admin) only: 404 from outside, 403 for its players. */
export async function teacherAccess(db: Db, user: User, studioId: string): Promise<StudioAccess> {
  const access = await studioAccess(db, user, studioId);
  if (access.role === 'player') throw forbidden("Only the studio's teacher may do this");
  return access;
}

/** A player of the studio, as its teacher sees them; anyone else is not found. */
export async function assertStudioPlayer(db: Db, studioId: string, playerId: string): Promise<void> {
  if (!isId(playerId)) throw notFound('That player');
  const [row] = await db
    .select({ id: studioMembers.playerId })
    .from(studioMembers)
    .where(and(eq(studioMembers.studioId, studioId), eq(studioMembers.playerId, playerId)))
    .limit(1);
  if (!row) throw notFound('That player');
}
