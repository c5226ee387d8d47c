import { createHash, randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { PasswordResetInput } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { passwordResets, users } from '../../db/schema';
import type { Mailer } from '../../mail/mailer';
import { passwordResetMail } from '../../mail/templates/password-reset';

export const RESET_LINK_MINUTES = 60;

export function hashResetToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/**
 * Makes a single-use reset link and mails it, when the address belongs to a working account.
 * Answers nothing either way, so the caller can't tell whether the address exists; the mail
 * is sent in the background for the same reason (no telling by timing).
 */
export async function requestPasswordReset(
  db: Db,
  mailer: Mailer,
  input: PasswordResetInput & { origin: string | null },
): Promise<void> {
  const [user] = await db.select().from(users).where(eq(users.email, input.email)).limit(1);
  if (!user || user.disabled) return;
  if (!input.origin) {
    console.error('[mail] set PUBLIC_URL so password-reset links point at this Sixfold; no link was sent');
    return;
  }
  const token = randomBytes(32).toString('base64url');
  await db.insert(passwordResets).values({
    userId: user.id,
    tokenHash: hashResetToken(token),
    expiresAt: new Date(Date.now() + RESET_LINK_MINUTES * 60_000),
  });
  const link = `${input.origin.replace(/\/+$/, '')}/reset-password?token=${encodeURIComponent(token)}`;
  const mail = passwordResetMail({ to: user.email, name: user.name, link, minutes: RESET_LINK_MINUTES });
  mailer.send(mail).catch((err: unknown) => {
    console.error('[mail] the password-reset e-mail could not be sent:', err instanceof Error ? err.message : err);
  });
}
