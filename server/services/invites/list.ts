import { and, desc, eq, gt, isNull } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Invite } from '../../../shared/schemas/studios';
import type { Db } from '../../db/client';
import { studioInvites } from '../../db/schema';
import { teacherAccess } from '../studios/access';
import { presentInvite } from './present';

/** The studio's invites still waiting for an answer, newest first (teacher only). */
export async function listInvites(db: Db, teacher: User, studioId: string): Promise<Invite[]> {
  await teacherAccess(db, teacher, studioId);
  const rows = await db
    .select()
    .from(studioInvites)
    .where(
      and(eq(studioInvites.studioId, studioId), isNull(studioInvites.usedAt), gt(studioInvites.expiresAt, new Date())),
    )
    .orderBy(desc(studioInvites.createdAt));
  return rows.map(presentInvite);
}
