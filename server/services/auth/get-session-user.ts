import { eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { users } from '../../db/schema';
import { presentUser } from './present-user';

/** The user behind a session, or null when the account is gone or switched off. */
export async function getSessionUser(db: Db, userId: string): Promise<User | null> {
  const [row] = await db
    .select({ id: users.id, email: users.email, name: users.name, role: users.role, disabled: users.disabled })
    .from(users)
    .where(eq(users.id, userId))
    .limit(1);
  if (!row || row.disabled) return null;
  return presentUser(row);
}
