import { and, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Remark } from '../../../shared/schemas/remarks';
import type { Db } from '../../db/client';
import { remarks } from '../../db/schema';
import { getTake } from '../takes/get';
import { inStudios, selectRemarks } from './present';
import { sharedStudioIds } from './visible-studios';

/**
 * The remarks on a take: every one for the take's player; for a teacher, those made in the
 * studios they teach (another studio's remarks stay out of sight). A take the viewer may not
 * see is a 404.
 */
export async function listRemarks(db: Db, viewer: User, takeId: string): Promise<Remark[]> {
  const take = await getTake(db, viewer, takeId);
  if (take.playerId === viewer.id) return selectRemarks(db, eq(remarks.takeId, takeId));
  const studios = await sharedStudioIds(db, viewer.id, take.playerId);
  if (studios.length === 0) return [];
  return selectRemarks(db, and(eq(remarks.takeId, takeId), inStudios(studios)));
}
