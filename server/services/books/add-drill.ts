import { and, eq, sql } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { AddBookDrillInput, Book } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { bookDrills, books, savedDrills } from '../../db/schema';
import { notFound } from '../../errors';
import { loadOwnBook } from './access';
import { presentOne } from './present';

/**
 * Adds one of the teacher's saved drills at the end of their book. The spec is copied now:
 * editing the saved drill later leaves the book (and what its buyers paid for) as it was.
 */
export async function addBookDrill(db: Db, teacher: User, bookId: string, input: AddBookDrillInput): Promise<Book> {
  await loadOwnBook(db, teacher, bookId);
  const [saved] = await db
    .select()
    .from(savedDrills)
    .where(and(eq(savedDrills.id, input.savedDrillId), eq(savedDrills.ownerId, teacher.id)))
    .limit(1);
  if (!saved) throw notFound('That saved drill');
  const row = await db.transaction(async (tx) => {
    const [book] = await tx.select().from(books).where(eq(books.id, bookId)).for('update');
    const [{ next }] = await tx
      .select({ next: sql<number>`coalesce(max(${bookDrills.position}) + 1, 0)::int` })
      .from(bookDrills)
      .where(eq(bookDrills.bookId, bookId));
    await tx.insert(bookDrills).values({
      bookId,
      position: next,
      savedDrillId: saved.id,
      title: input.title ?? saved.name,
      note: input.note,
      spec: saved.spec,
      keyCycle: input.keyCycle === undefined ? (saved.keyOrder ?? null) : input.keyCycle,
    });
    const [after] = await tx.update(books).set({ updatedAt: new Date() }).where(eq(books.id, book.id)).returning();
    return after;
  });
  return presentOne(db, row, 'owner');
}
