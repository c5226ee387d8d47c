import { asc, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Book, UpdateBookInput } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { bookDrills, books } from '../../db/schema';
import { AppError } from '../../errors';
import { loadOwnBook } from './access';
import { presentOne } from './present';

/**
 * The teacher changes their book. Publishing needs at least one drill; when no drill is marked
 * free to try, the first one becomes free, so every published book has one.
 */
export async function updateBook(db: Db, teacher: User, id: string, input: UpdateBookInput): Promise<Book> {
  await loadOwnBook(db, teacher, id);
  const row = await db.transaction(async (tx) => {
    const [before] = await tx.select().from(books).where(eq(books.id, id)).for('update');
    if (input.published && !before.published) {
      const drills = await tx
        .select()
        .from(bookDrills)
        .where(eq(bookDrills.bookId, id))
        .orderBy(asc(bookDrills.position));
      if (drills.length === 0)
        throw new AppError('validation', 'Add at least one drill before publishing', {
          published: ['Add at least one drill before publishing'],
        });
      if (!drills.some((d) => d.free))
        await tx.update(bookDrills).set({ free: true }).where(eq(bookDrills.id, drills[0].id));
    }
    const publishedAt = input.published === true && !before.published ? new Date() : undefined;
    const [after] = await tx
      .update(books)
      .set({ ...input, ...(publishedAt ? { publishedAt } : {}), updatedAt: new Date() })
      .where(eq(books.id, id))
      .returning();
    return after;
  });
  return presentOne(db, row, 'owner');
}
