import type { User } from '../../../shared/schemas/auth';
import type { Book, CreateBookInput } from '../../../shared/schemas/books';
import type { Db } from '../../db/client';
import { books } from '../../db/schema';
import { presentBook } from './present';

/** A new draft book of the teacher's, with no drills yet. */
export async function createBook(db: Db, teacher: User, input: CreateBookInput): Promise<Book> {
  const [row] = await db
    .insert(books)
    .values({ teacherId: teacher.id, ...input })
    .returning();
  return presentBook(row, { id: teacher.id, name: teacher.name }, [], 'owner');
}
