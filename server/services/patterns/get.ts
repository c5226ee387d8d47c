import { and, eq, inArray } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { CustomPattern } from '../../../shared/schemas/drills';
import type { Db } from '../../db/client';
import { customPatterns } from '../../db/schema';
import { notFound } from '../../errors';
import { ownerOf } from '../drills/present';
import { isId, visibleOwnerIds } from '../drills/visible-owner-ids';
import { presentCustomPattern } from './present';

/** One pattern the user may read; anyone else's is "not found". */
export async function getCustomPattern(db: Db, user: User, id: string): Promise<CustomPattern> {
  if (!isId(id)) throw notFound('That pattern');
  const ownerIds = await visibleOwnerIds(db, user);
  const [row] = await db
    .select()
    .from(customPatterns)
    .where(and(eq(customPatterns.id, id), inArray(customPatterns.ownerId, ownerIds)));
  if (!row) throw notFound('That pattern');
  return presentCustomPattern(row, await ownerOf(db, row.ownerId), user);
}
