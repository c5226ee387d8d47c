import { asc, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { BookEditionResponse } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { bookDrills } from '../../db/schema';
import { notFound } from '../../errors';
import { loadVisibleBook } from './access';
import { presentBookDrill, presentOne } from './present';

/** Every drill in full for the printable edition: only for those who may open them all. */
export async function getBookEdition(db: Db, viewer: User | undefined, bookId: string): Promise<BookEditionResponse> {
  const { book, access } = await loadVisibleBook(db, viewer, bookId);
  if (access === 'free-drill-only') throw notFound('That book’s printable edition');
  const rows = await db
    .select()
    .from(bookDrills)
    .where(eq(bookDrills.bookId, bookId))
    .orderBy(asc(bookDrills.position));
  return { book: await presentOne(db, book, access), drills: rows.map(presentBookDrill) };
}
