import { asc, eq, inArray, type SQL } from 'drizzle-orm';
import type { Remark } from '../../../shared/schemas/remarks';
import type { Db } from '../../db/client';
import { remarks, users } from '../../db/schema';

/** Remarks with their authors, oldest first. */
export async function selectRemarks(db: Db, where: SQL | undefined): Promise<Remark[]> {
  const rows = await db
    .select({ r: remarks, name: users.name, role: users.role })
    .from(remarks)
    .innerJoin(users, eq(users.id, remarks.authorId))
    .where(where)
    .orderBy(asc(remarks.createdAt));
  return rows.map(({ r, name, role }) => ({
    id: r.id,
    takeId: r.takeId,
    studioId: r.studioId,
    parentId: r.parentId,
    noteIndex: r.noteIndex,
    body: r.body,
    author: { id: r.authorId, name, role },
    createdAt: r.createdAt.toISOString(),
  }));
}

export const inStudios = (ids: string[]) => inArray(remarks.studioId, ids);
