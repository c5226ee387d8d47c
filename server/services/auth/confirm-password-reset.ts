import { and, eq, gt, isNull, sql } from 'drizzle-orm';
import type { PasswordResetConfirmInput } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { passwordResets, signInFailures, users } from '../../db/schema';
import { AppError } from '../../errors';
import { endSessions } from './end-sessions';
import { hashPassword } from './password-hash';
import { hashResetToken } from './request-password-reset';

const spent = () =>
  new AppError('validation', 'This link has expired or was already used', {
    token: ['This link has expired or was already used; ask for a new one'],
  });

/** Sets a new password from a reset link; the link is spent at once, and all sessions end. */
export async function confirmPasswordReset(db: Db, input: PasswordResetConfirmInput): Promise<void> {
  const passwordHash = await hashPassword(input.password);
  await db.transaction(async (tx) => {
    // One UPDATE both checks and spends the link, so two clicks at once can't both win.
    const [reset] = await tx
      .update(passwordResets)
      .set({ usedAt: sql`now()` })
      .where(
        and(
          eq(passwordResets.tokenHash, hashResetToken(input.token)),
          isNull(passwordResets.usedAt),
          gt(passwordResets.expiresAt, sql`now()`),
        ),
      )
      .returning({ userId: passwordResets.userId });
    if (!reset) throw spent();
    const [user] = await tx
      .update(users)
      .set({ passwordHash })
      .where(eq(users.id, reset.userId))
      .returning({ email: users.email });
    // Any other links for this account are spent too.
    await tx
      .update(passwordResets)
      .set({ usedAt: sql`now()` })
      .where(and(eq(passwordResets.userId, reset.userId), isNull(passwordResets.usedAt)));
    if (user) await tx.delete(signInFailures).where(eq(signInFailures.email, user.email));
    await endSessions(tx, reset.userId);
  });
}
