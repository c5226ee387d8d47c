import { desc, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Book } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { books } from '../../db/schema';
import { drillsByBook, presentBook } from './present';

/** A teacher's own books, drafts included, last changed first. */
export async function listTeacherBooks(db: Db, teacher: User): Promise<Book[]> {
  const rows = await db.select().from(books).where(eq(books.teacherId, teacher.id)).orderBy(desc(books.updatedAt));
  const drills = await drillsByBook(
    db,
    rows.map((r) => r.id),
  );
  return rows.map((r) => presentBook(r, { id: teacher.id, name: teacher.name }, drills.get(r.id) ?? [], 'owner'));
}
