import { and, eq, inArray } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { SavedDrill } from '../../../shared/schemas/drills';
import type { Db } from '../../db/client';
import { savedDrills } from '../../db/schema';
import { notFound } from '../../errors';
import { ownerOf, presentSavedDrill } from './present';
import { isId, visibleOwnerIds } from './visible-owner-ids';

/** One saved drill the user may read; anyone else's is "not found", so it is never revealed. */
export async function getSavedDrill(db: Db, user: User, id: string): Promise<SavedDrill> {
  if (!isId(id)) throw notFound('That drill');
  const ownerIds = await visibleOwnerIds(db, user);
  const [row] = await db
    .select()
    .from(savedDrills)
    .where(and(eq(savedDrills.id, id), inArray(savedDrills.ownerId, ownerIds)));
  if (!row) throw notFound('That drill');
  return presentSavedDrill(row, await ownerOf(db, row.ownerId), user);
}
