import { and, desc, eq, inArray } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Book, BookAccess } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { books, purchases } from '../../db/schema';
import { drillsByBook, presentBook, teachersById } from './present';

/** The catalogue: every published book, newest first, with the viewer's access to each. */
export async function listPublishedBooks(db: Db, viewer: User | undefined): Promise<Book[]> {
  const rows = await db
    .select()
    .from(books)
    .where(eq(books.published, true))
    .orderBy(desc(books.publishedAt))
    .limit(500);
  const ids = rows.map((r) => r.id);
  const bought = new Set<string>();
  if (viewer && ids.length > 0) {
    const paid = await db
      .select({ bookId: purchases.bookId })
      .from(purchases)
      .where(and(eq(purchases.playerId, viewer.id), eq(purchases.status, 'paid'), inArray(purchases.bookId, ids)));
    for (const p of paid) bought.add(p.bookId);
  }
  const drills = await drillsByBook(db, ids);
  const teachers = await teachersById(
    db,
    rows.map((r) => r.teacherId),
  );
  return rows.map((r) => {
    const access: BookAccess =
      viewer?.id === r.teacherId
        ? 'owner'
        : r.priceMinor === 0
          ? 'free-book'
          : bought.has(r.id)
            ? 'bought'
            : 'free-drill-only';
    return presentBook(r, teachers.get(r.teacherId)!, drills.get(r.id) ?? [], access);
  });
}
