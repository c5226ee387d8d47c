import { desc, inArray } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { CustomPattern } from '../../../shared/schemas/drills';
import type { Db } from '../../db/client';
import { customPatterns } from '../../db/schema';
import { ownersById } from '../drills/present';
import { visibleOwnerIds } from '../drills/visible-owner-ids';
import { presentCustomPattern } from './present';

/** The user's own patterns and their studios' teachers', newest change first. */
export async function listCustomPatterns(db: Db, user: User): Promise<CustomPattern[]> {
  const ownerIds = await visibleOwnerIds(db, user);
  const rows = await db
    .select()
    .from(customPatterns)
    .where(inArray(customPatterns.ownerId, ownerIds))
    .orderBy(desc(customPatterns.updatedAt))
    .limit(500);
  const owners = await ownersById(db, ownerIds);
  return rows.map((r) => presentCustomPattern(r, owners.get(r.ownerId)!, user));
}
