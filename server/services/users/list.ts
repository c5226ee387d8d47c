import { asc } from 'drizzle-orm';
import type { AdminUser } from '../../../shared/schemas/admin';
import type { Db } from '../../db/client';
import { users } from '../../db/schema';

/** Every account, oldest first, for the admin's list. */
export async function listUsers(db: Db): Promise<AdminUser[]> {
  const rows = await db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      role: users.role,
      disabled: users.disabled,
      createdAt: users.createdAt,
    })
    .from(users)
    .orderBy(asc(users.createdAt), asc(users.email));
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}
