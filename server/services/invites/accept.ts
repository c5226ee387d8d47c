import { eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { AcceptInviteResponse } from '../../../shared/schemas/studios';
import type { Db } from '../../db/client';
import { notifications, studioInvites, studioMembers, studios } from '../../db/schema';
import { AppError } from '../../errors';
import { findUsableInvite } from './find';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/** Inside a transaction: the link is spent and the player joins (once, even if already in). */
export async function joinThroughInvite(tx: Tx, token: string, player: User): Promise<AcceptInviteResponse['studio']> {
  const { invite, studioName } = await findUsableInvite(tx, token, true);
  await tx.update(studioInvites).set({ usedAt: new Date(), usedBy: player.id }).where(eq(studioInvites.id, invite.id));
  await tx.insert(studioMembers).values({ studioId: invite.studioId, playerId: player.id }).onConflictDoNothing();
  const [studio] = await tx
    .select({ teacherId: studios.teacherId })
    .from(studios)
    .where(eq(studios.id, invite.studioId));
  await tx.insert(notifications).values({
    userId: studio.teacherId,
    kind: 'joined',
    text: `${player.name} joined ${studioName}`,
    link: `/studio/${invite.studioId}`,
  });
  return { studioId: invite.studioId, studioName };
}

/**
 * A signed-in player answers an invite. The link is the proof: whoever holds it may use it
 * once, as with the address it was sent to (a player may sign in with another address).
 */
export async function acceptInvite(db: Db, player: User, token: string): Promise<AcceptInviteResponse['studio']> {
  if (player.role !== 'player')
    throw new AppError('forbidden', 'Studios are for players; sign in with a player account to join');
  return db.transaction((tx) => joinThroughInvite(tx, token, player));
}
