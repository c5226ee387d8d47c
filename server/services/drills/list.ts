import { desc, inArray } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { SavedDrill } from '../../../shared/schemas/drills';
import type { Db } from '../../db/client';
import { savedDrills } from '../../db/schema';
import { ownersById, presentSavedDrill } from './present';
import { visibleOwnerIds } from './visible-owner-ids';

/** The user's own saved drills and their studios' teachers', newest change first. */
export async function listSavedDrills(db: Db, user: User): Promise<SavedDrill[]> {
  const ownerIds = await visibleOwnerIds(db, user);
  const rows = await db
    .select()
    .from(savedDrills)
    .where(inArray(savedDrills.ownerId, ownerIds))
    .orderBy(desc(savedDrills.updatedAt))
    .limit(500);
  const owners = await ownersById(db, ownerIds);
  return rows.map((r) => presentSavedDrill(r, owners.get(r.ownerId)!, user));
}
