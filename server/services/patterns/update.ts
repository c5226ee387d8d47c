import { and, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { CustomPattern, UpdateCustomPatternInput } from '../../../shared/schemas/drills';
import type { Db } from '../../db/client';
import { customPatterns } from '../../db/schema';
import { notFound } from '../../errors';
import { isId } from '../drills/visible-owner-ids';
import { presentCustomPattern } from './present';

/** Renames or redefines the user's own pattern; anyone else's is 404. */
export async function updateCustomPattern(
  db: Db,
  user: User,
  id: string,
  input: UpdateCustomPatternInput,
): Promise<CustomPattern> {
  if (!isId(id)) throw notFound('That pattern');
  const [row] = await db
    .update(customPatterns)
    .set({
      ...(input.name !== undefined ? { name: input.name } : {}),
      ...(input.def !== undefined ? { def: input.def } : {}),
    })
    .where(and(eq(customPatterns.id, id), eq(customPatterns.ownerId, user.id)))
    .returning();
  if (!row) throw notFound('That pattern');
  return presentCustomPattern(row, { id: user.id, name: user.name, role: user.role }, user);
}
