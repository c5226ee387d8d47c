import { eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { type StudioInviteRow, studioInvites, studios, users } from '../../db/schema';
import { AppError } from '../../errors';
import { hashInviteToken } from './token';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

const gone = () =>
  new AppError('not_found', 'This invite link has been used or has expired; ask your teacher for a new one');

/**
 * The invite behind a token while it still works (not used, not expired), with its studio.
 * A used, expired or unknown link are all the same 404. `forUpdate` locks the row, so two
 * answers to one link cannot both get in.
 */
export async function findUsableInvite(db: Db | Tx, token: string, forUpdate = false) {
  const q = db
    .select({ invite: studioInvites, studioName: studios.name, teacherName: users.name })
    .from(studioInvites)
    .innerJoin(studios, eq(studios.id, studioInvites.studioId))
    .innerJoin(users, eq(users.id, studios.teacherId))
    .where(eq(studioInvites.tokenHash, hashInviteToken(token)))
    .limit(1);
  const [row] = forUpdate ? await q.for('update', { of: studioInvites }) : await q;
  if (!row || row.invite.usedAt || row.invite.expiresAt.getTime() <= Date.now()) throw gone();
  return row as { invite: StudioInviteRow; studioName: string; teacherName: string };
}
