import { eq } from 'drizzle-orm';
import type { InvitePreview } from '../../../shared/schemas/studios';
import type { Db } from '../../db/client';
import { users } from '../../db/schema';
import { findUsableInvite } from './find';

/** What the invite page shows: whose studio, for which address, and whether to sign in or up. */
export async function previewInvite(db: Db, token: string): Promise<InvitePreview> {
  const { invite, studioName, teacherName } = await findUsableInvite(db, token);
  const [account] = await db.select({ id: users.id }).from(users).where(eq(users.email, invite.email)).limit(1);
  return {
    studio: { id: invite.studioId, name: studioName },
    teacher: { name: teacherName },
    email: invite.email,
    accountExists: Boolean(account),
    expiresAt: invite.expiresAt.toISOString(),
  };
}
