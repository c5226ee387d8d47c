import { and, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { BookDrill } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { bookDrills } from '../../db/schema';
import { notFound } from '../../errors';
import { isId } from '../drills/visible-owner-ids';
import { loadVisibleBook } from './access';
import { presentBookDrill } from './present';

/**
 * One drill of a book, in full, for its teacher, a buyer, anyone on a free book, or anyone
 * when it is the free drill. Everyone else gets 404, exactly as for a drill that is not there.
 */
export async function getBookDrill(
  db: Db,
  viewer: User | undefined,
  bookId: string,
  drillId: string,
): Promise<BookDrill> {
  const { access } = await loadVisibleBook(db, viewer, bookId);
  if (!isId(drillId)) throw notFound('That drill');
  const [row] = await db
    .select()
    .from(bookDrills)
    .where(and(eq(bookDrills.id, drillId), eq(bookDrills.bookId, bookId)))
    .limit(1);
  if (!row || (access === 'free-drill-only' && !row.free)) throw notFound('That drill');
  return presentBookDrill(row);
}
