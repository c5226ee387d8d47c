import { eq } from 'drizzle-orm';
import type { UpdateAccountInput, User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { users } from '../../db/schema';
import { notFound } from '../../errors';
import { presentUser } from './present-user';

export async function updateAccount(db: Db, userId: string, input: UpdateAccountInput): Promise<User> {
  const [row] = await db.update(users).set({ name: input.name }).where(eq(users.id, userId)).returning();
  if (!row) throw notFound('Your account');
  return presentUser(row);
}
