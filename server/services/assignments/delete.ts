import { eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { assignments } from '../../db/schema';
import { notFound } from '../../errors';
import { isId } from '../drills/visible-owner-ids';
import { teacherAccess } from '../studios/access';

/** The teacher withdraws an assignment; takes made from it keep their assignmentId. */
export async function deleteAssignment(db: Db, teacher: User, id: string): Promise<void> {
  if (!isId(id)) throw notFound('That assignment');
  const [row] = await db
    .select({ studioId: assignments.studioId })
    .from(assignments)
    .where(eq(assignments.id, id))
    .limit(1);
  if (!row) throw notFound('That assignment');
  await teacherAccess(db, teacher, row.studioId);
  await db.delete(assignments).where(eq(assignments.id, id));
}
