import { and, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { SavedDrill, UpdateSavedDrillInput } from '../../../shared/schemas/drills';
import type { Db } from '../../db/client';
import { savedDrills } from '../../db/schema';
import { notFound } from '../../errors';
import { assertPlayable } from './create';
import { presentSavedDrill } from './present';
import { isId } from './visible-owner-ids';

/** Renames or changes the user's own saved drill; anyone else's (even a readable one) is 404. */
export async function updateSavedDrill(
  db: Db,
  user: User,
  id: string,
  input: UpdateSavedDrillInput,
): Promise<SavedDrill> {
  if (!isId(id)) throw notFound('That drill');
  if (input.spec) assertPlayable(input.spec);
  const [row] = await db
    .update(savedDrills)
    .set({
      ...(input.name !== undefined ? { name: input.name } : {}),
      ...(input.spec !== undefined ? { spec: input.spec } : {}),
      ...(input.keyOrder !== undefined ? { keyOrder: input.keyOrder } : {}),
    })
    .where(and(eq(savedDrills.id, id), eq(savedDrills.ownerId, user.id)))
    .returning();
  if (!row) throw notFound('That drill');
  return presentSavedDrill(row, { id: user.id, name: user.name, role: user.role }, user);
}
