import { and, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { studioMembers } from '../../db/schema';
import { AppError } from '../../errors';
import { studioAccess } from './access';

/** A player leaves a studio; their takes stay theirs, the teacher no longer sees them. */
export async function leaveStudio(db: Db, user: User, studioId: string): Promise<void> {
  const access = await studioAccess(db, user, studioId);
  if (access.role !== 'player') throw new AppError('bad_request', 'Only a player of the studio can leave it');
  await db.delete(studioMembers).where(and(eq(studioMembers.studioId, studioId), eq(studioMembers.playerId, user.id)));
}
