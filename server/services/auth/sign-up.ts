import { eq } from 'drizzle-orm';
import type { SignUpInput, User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { users } from '../../db/schema';
import { AppError } from '../../errors';
import { hashPassword } from './password-hash';
import { presentUser } from './present-user';

const taken = () =>
  new AppError('conflict', 'An account already uses this address', {
    email: ['An account already uses this address; sign in or reset the password'],
  });

/** Creates a player or teacher account (admins are made by hand, never by sign-up). */
export async function signUp(db: Db, input: SignUpInput): Promise<User> {
  const existing = await db.select({ id: users.id }).from(users).where(eq(users.email, input.email)).limit(1);
  if (existing.length > 0) throw taken();
  const passwordHash = await hashPassword(input.password);
  const rows = await db
    .insert(users)
    .values({ email: input.email, name: input.name, role: input.role, passwordHash })
    .onConflictDoNothing({ target: users.email })
    .returning();
  // Two sign-ups for one address at the same moment: the second loses here.
  if (rows.length === 0) throw taken();
  return presentUser(rows[0]);
}
