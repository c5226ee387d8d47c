import { eq } from 'drizzle-orm';
import type { ChangePasswordInput } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { users } from '../../db/schema';
import { AppError, notFound } from '../../errors';
import { endSessions } from './end-sessions';
import { hashPassword, verifyPassword } from './password-hash';

/** Changes a password after checking the current one; every other session of the user ends. */
export async function changePassword(
  db: Db,
  userId: string,
  input: ChangePasswordInput,
  currentSid?: string,
): Promise<void> {
  const [user] = await db.select().from(users).where(eq(users.id, userId)).limit(1);
  if (!user) throw notFound('Your account');
  if (!(await verifyPassword(user.passwordHash, input.currentPassword))) {
    throw new AppError('validation', 'Check these fields: currentPassword', {
      currentPassword: ['That is not your current password'],
    });
  }
  await db
    .update(users)
    .set({ passwordHash: await hashPassword(input.newPassword) })
    .where(eq(users.id, userId));
  await endSessions(db, userId, currentSid);
}
