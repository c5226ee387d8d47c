import { eq } from 'drizzle-orm';
import type { AdminUser, UpdateAdminUserInput } from '../../../shared/schemas/admin';
import type { User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { auditLog, users } from '../../db/schema';
import { AppError, notFound } from '../../errors';
import { endSessions } from '../auth/end-sessions';

/**
 * An admin changes an account's role or switches it off (or on). Switching off ends every
 * session of the account at once. Each change is written to the audit log in the same
 * transaction. An admin may not demote or switch off their own account (no locking out).
 */
export async function updateUserByAdmin(
  db: Db,
  admin: User,
  userId: string,
  input: UpdateAdminUserInput,
): Promise<AdminUser> {
  if (userId === admin.id) throw new AppError('bad_request', 'Change your own account from another admin account');
  return db.transaction(async (tx) => {
    const [before] = await tx.select().from(users).where(eq(users.id, userId)).for('update').limit(1);
    if (!before) throw notFound('That account');
    const changes: Partial<typeof users.$inferInsert> = {};
    if (input.role !== undefined && input.role !== before.role) {
      changes.role = input.role;
      await tx.insert(auditLog).values({
        actorId: admin.id,
        targetId: userId,
        action: 'role.change',
        detail: { from: before.role, to: input.role },
      });
    }
    if (input.disabled !== undefined && input.disabled !== before.disabled) {
      changes.disabled = input.disabled;
      await tx.insert(auditLog).values({
        actorId: admin.id,
        targetId: userId,
        action: input.disabled ? 'account.disable' : 'account.enable',
        detail: { disabled: input.disabled },
      });
      if (input.disabled) await endSessions(tx, userId);
    }
    const [after] =
      Object.keys(changes).length > 0
        ? await tx.update(users).set(changes).where(eq(users.id, userId)).returning()
        : [before];
    return {
      id: after.id,
      email: after.email,
      name: after.name,
      role: after.role,
      disabled: after.disabled,
      createdAt: after.createdAt.toISOString(),
    };
  });
}
