import { and, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { savedDrills } from '../../db/schema';
import { notFound } from '../../errors';
import { isId } from './visible-owner-ids';

/** Deletes the user's own saved drill; anyone else's is 404. */
export async function deleteSavedDrill(db: Db, user: User, id: string): Promise<void> {
  if (!isId(id)) throw notFound('That drill');
  const rows = await db
    .delete(savedDrills)
    .where(and(eq(savedDrills.id, id), eq(savedDrills.ownerId, user.id)))
    .returning({ id: savedDrills.id });
  if (rows.length === 0) throw notFound('That drill');
}
