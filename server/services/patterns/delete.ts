import { and, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { customPatterns } from '../../db/schema';
import { notFound } from '../../errors';
import { isId } from '../drills/visible-owner-ids';

/** Deletes the user's own pattern (drills saved with it keep their own copy); anyone else's is 404. */
export async function deleteCustomPattern(db: Db, user: User, id: string): Promise<void> {
  if (!isId(id)) throw notFound('That pattern');
  const rows = await db
    .delete(customPatterns)
    .where(and(eq(customPatterns.id, id), eq(customPatterns.ownerId, user.id)))
    .returning({ id: customPatterns.id });
  if (rows.length === 0) throw notFound('That pattern');
}
