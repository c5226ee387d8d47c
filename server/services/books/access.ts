import { and, eq } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { BookAccess } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { type BookRow, books, purchases } from '../../db/schema';
import { notFound } from '../../errors';
import { isId } from '../drills/visible-owner-ids';

/** Whether the player holds a paid, unrefunded purchase of the book. */
export async function hasBought(db: Db, bookId: string, playerId: string): Promise<boolean> {
  const [row] = await db
    .select({ id: purchases.id })
    .from(purchases)
    .where(and(eq(purchases.bookId, bookId), eq(purchases.playerId, playerId), eq(purchases.status, 'paid')))
    .limit(1);
  return !!row;
}

/**
 * What a viewer may open in a book: all of it for its teacher, a buyer, or anyone when the
 * book is free; else the free drill only. A draft is its teacher's alone: null for anyone else.
 */
export async function accessTo(db: Db, viewer: User | undefined, book: BookRow): Promise<BookAccess | null> {
  if (viewer && viewer.id === book.teacherId) return 'owner';
  if (!book.published) return null;
  if (book.priceMinor === 0) return 'free-book';
  if (viewer && (await hasBought(db, book.id, viewer.id))) return 'bought';
  return 'free-drill-only';
}

/** A book the viewer may see (published, or their own draft), with their access; else 404. */
export async function loadVisibleBook(
  db: Db,
  viewer: User | undefined,
  id: string,
): Promise<{ book: BookRow; access: BookAccess }> {
  if (!isId(id)) throw notFound('That book');
  const [book] = await db.select().from(books).where(eq(books.id, id)).limit(1);
  if (!book) throw notFound('That book');
  const access = await accessTo(db, viewer, book);
  if (!access) throw notFound('That book');
  return { book, access };
}

/** The teacher's own book, for changing it; anyone else's is 404 (never revealed). */
export async function loadOwnBook(db: Db, teacher: User, id: string): Promise<BookRow> {
  if (!isId(id)) throw notFound('That book');
  const [book] = await db
    .select()
    .from(books)
    .where(and(eq(books.id, id), eq(books.teacherId, teacher.id)))
    .limit(1);
  if (!book) throw notFound('That book');
  return book;
}
