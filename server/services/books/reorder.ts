import { eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Book, ReorderBookInput } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { bookDrills, books } from '../../db/schema';
import { AppError } from '../../errors';
import { loadOwnBook } from './access';
import { presentOne } from './present';

/** Puts the book's drills in the given order; the list must name each of its drills once. */
export async function reorderBook(db: Db, teacher: User, bookId: string, input: ReorderBookInput): Promise<Book> {
  await loadOwnBook(db, teacher, bookId);
  const row = await db.transaction(async (tx) => {
    const [book] = await tx.select().from(books).where(eq(books.id, bookId)).for('update');
    const current = await tx.select({ id: bookDrills.id }).from(bookDrills).where(eq(bookDrills.bookId, bookId));
    const have = new Set(current.map((d) => d.id));
    const given = new Set(input.drillIds);
    if (given.size !== input.drillIds.length || given.size !== have.size || ![...given].every((id) => have.has(id))) {
      throw new AppError('validation', 'List every drill of the book once', {
        drillIds: ['List every drill of the book once'],
      });
    }
    for (const [position, id] of input.drillIds.entries())
      await tx.update(bookDrills).set({ position }).where(eq(bookDrills.id, id));
    const [after] = await tx.update(books).set({ updatedAt: new Date() }).where(eq(books.id, book.id)).returning();
    return after;
  });
  return presentOne(db, row, 'owner');
}
