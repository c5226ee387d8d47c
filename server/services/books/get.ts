import type { User } from '../../../shared/schemas/auth';
import type { Book } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { loadVisibleBook } from './access';
import { presentOne } from './present';

/** A book's page: a published book for anyone, a draft for its teacher; else 404. */
export async function getBook(db: Db, viewer: User | undefined, id: string): Promise<Book> {
  const { book, access } = await loadVisibleBook(db, viewer, id);
  return presentOne(db, book, access);
}
