import { eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import { type CreateInviteInput, INVITE_DAYS, type Invite } from '../../../shared/schemas/studios';
import type { Db } from '../../db/client';
import { studioInvites } from '../../db/schema';
import { AppError } from '../../errors';
import type { Mailer } from '../../mail/mailer';
import { studioInviteMail } from '../../mail/templates/studio-invite';
import { teacherAccess } from '../studios/access';
import { hashInviteToken, newInviteToken } from './token';
import { presentInvite } from './present';

/**
 * Invites an address to the studio: a single-use link, good for seven days, sent by e-mail.
 * The mail is awaited, so the teacher hears at once when it could not go out.
 */
export async function createInvite(
  db: Db,
  mailer: Mailer,
  teacher: User,
  studioId: string,
  input: CreateInviteInput & { origin: string | null },
): Promise<Invite> {
  const { studio } = await teacherAccess(db, teacher, studioId);
  if (!input.origin) throw new AppError('unavailable', 'Set PUBLIC_URL so invite links point at this Sixfold');
  const token = newInviteToken();
  const [row] = await db
    .insert(studioInvites)
    .values({
      studioId,
      email: input.email,
      tokenHash: hashInviteToken(token),
      invitedBy: teacher.id,
      expiresAt: new Date(Date.now() + INVITE_DAYS * 24 * 60 * 60_000),
    })
    .returning();
  const link = `${input.origin}/invite?token=${encodeURIComponent(token)}`;
  try {
    await mailer.send(
      studioInviteMail({ to: input.email, teacher: teacher.name, studio: studio.name, link, days: INVITE_DAYS }),
    );
  } catch (err) {
    console.error('[mail] the invite could not be sent:', err instanceof Error ? err.message : err);
    await db.delete(studioInvites).where(eq(studioInvites.id, row.id));
    throw new AppError('unavailable', 'The invite e-mail could not be sent; try again in a minute');
  }
  return presentInvite(row);
}
