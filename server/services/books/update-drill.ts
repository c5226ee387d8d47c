import { and, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Book, UpdateBookDrillInput } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { bookDrills, books } from '../../db/schema';
import { notFound } from '../../errors';
import { isId } from '../drills/visible-owner-ids';
import { loadOwnBook } from './access';
import { presentOne } from './present';

/** Changes a drill's title, note or key cycle; `free: true` makes it the one drill free to try. */
export async function updateBookDrill(
  db: Db,
  teacher: User,
  bookId: string,
  drillId: string,
  input: UpdateBookDrillInput,
): Promise<Book> {
  await loadOwnBook(db, teacher, bookId);
  if (!isId(drillId)) throw notFound('That drill');
  const row = await db.transaction(async (tx) => {
    const [book] = await tx.select().from(books).where(eq(books.id, bookId)).for('update');
    const [drill] = await tx
      .select({ id: bookDrills.id })
      .from(bookDrills)
      .where(and(eq(bookDrills.id, drillId), eq(bookDrills.bookId, bookId)));
    if (!drill) throw notFound('That drill');
    const { free, ...fields } = input;
    if (free)
      await tx
        .update(bookDrills)
        .set({ free: false })
        .where(and(eq(bookDrills.bookId, bookId), eq(bookDrills.free, true)));
    await tx
      .update(bookDrills)
      .set({ ...fields, ...(free ? { free: true } : {}) })
      .where(eq(bookDrills.id, drillId));
    const [after] = await tx.update(books).set({ updatedAt: new Date() }).where(eq(books.id, book.id)).returning();
    return after;
  });
  return presentOne(db, row, 'owner');
}
