import { and, asc, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { StudioDetail } from '../../../shared/schemas/studios';
import type { Db } from '../../db/client';
import { studioMembers, users } from '../../db/schema';
import { notFound } from '../../errors';
import { studioAccess } from './access';
import { presentStudios } from './present-studios';

/**
 * One studio, if the user may see it; otherwise 404, so another's studio isn't revealed.
 * Its teacher and admins see every player; a player sees only themselves among them.
 */
export async function getStudio(db: Db, user: User, id: string): Promise<StudioDetail> {
  const access = await studioAccess(db, user, id);
  const [studio] = await presentStudios(db, user, [id]);
  if (!studio) throw notFound('That studio');
  const players = await db
    .select({ id: users.id, name: users.name, email: users.email })
    .from(studioMembers)
    .innerJoin(users, eq(users.id, studioMembers.playerId))
    .where(
      access.role === 'player'
        ? and(eq(studioMembers.studioId, id), eq(studioMembers.playerId, user.id))
        : eq(studioMembers.studioId, id),
    )
    .orderBy(asc(users.name));
  return { ...studio, players };
}
