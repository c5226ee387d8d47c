import { and, asc, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Book } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { bookDrills, books } from '../../db/schema';
import { AppError, notFound } from '../../errors';
import { isId } from '../drills/visible-owner-ids';
import { loadOwnBook } from './access';
import { presentOne } from './present';

/**
 * Takes a drill out of the teacher's book. A published book keeps at least one drill, and when
 * the free drill goes, the first remaining one becomes free.
 */
export async function removeBookDrill(db: Db, teacher: User, bookId: string, drillId: string): Promise<Book> {
  await loadOwnBook(db, teacher, bookId);
  if (!isId(drillId)) throw notFound('That drill');
  const row = await db.transaction(async (tx) => {
    const [book] = await tx.select().from(books).where(eq(books.id, bookId)).for('update');
    const [gone] = await tx
      .delete(bookDrills)
      .where(and(eq(bookDrills.id, drillId), eq(bookDrills.bookId, bookId)))
      .returning();
    if (!gone) throw notFound('That drill');
    const rest = await tx
      .select()
      .from(bookDrills)
      .where(eq(bookDrills.bookId, bookId))
      .orderBy(asc(bookDrills.position));
    if (book.published && rest.length === 0)
      throw new AppError('bad_request', 'A published book keeps at least one drill; unpublish it first');
    if (gone.free && book.published)
      await tx.update(bookDrills).set({ free: true }).where(eq(bookDrills.id, rest[0].id));
    const [after] = await tx.update(books).set({ updatedAt: new Date() }).where(eq(books.id, book.id)).returning();
    return after;
  });
  return presentOne(db, row, 'owner');
}
