import type { User } from '../../../shared/schemas/auth';
import { generateChecked } from '../../../shared/engine/patterns/checked';
import type { CreateSavedDrillInput, SavedDrill } from '../../../shared/schemas/drills';
import type { Db } from '../../db/client';
import { savedDrills } from '../../db/schema';
import { AppError } from '../../errors';
import { presentSavedDrill } from './present';

/** Checks that the spec makes a drill at all (a 400 naming the field if not) before keeping it. */
export function assertPlayable(spec: CreateSavedDrillInput['spec']): void {
  const result = generateChecked(spec);
  if (!result.ok) {
    const fields = Object.fromEntries(Object.entries(result.fields).map(([k, v]) => [`spec.${k}`, v]));
    throw new AppError('validation', result.message, fields);
  }
}

export async function createSavedDrill(db: Db, user: User, input: CreateSavedDrillInput): Promise<SavedDrill> {
  assertPlayable(input.spec);
  const [row] = await db
    .insert(savedDrills)
    .values({ ownerId: user.id, name: input.name, spec: input.spec, keyOrder: input.keyOrder ?? null })
    .returning();
  return presentSavedDrill(row, { id: user.id, name: user.name, role: user.role }, user);
}
