import { useMe } from '@/features/auth/api/session';
import { useCatalogue } from '@/features/books/api/books';
import { BookCard } from '@/features/books/components/book-card';
import { MyBooks } from '@/features/books/components/my-books';

/** /books: the catalogue of published drill books; a teacher's own books above it. */
export function BooksRoute() {
  const { user } = useMe();
  const { data, isPending, error } = useCatalogue();
  return (
    <div className="grid gap-8">
      {user?.role === 'teacher' ? <MyBooks /> : null}
      <section className="grid gap-4" aria-labelledby="catalogue">
        <div>
          <h1 id="catalogue" className="text-title">
            Drill books
          </h1>
          <p className="text-muted">
            Collections written by teachers, to practise and be scored on in all twelve keys. Every book has one drill
            free to try.
          </p>
        </div>
        {isPending ? <p className="text-muted">Loading the books…</p> : null}
        {error ? <p role="alert">{error.message}</p> : null}
        {data && data.books.length === 0 ? <p className="text-muted">No books are published yet.</p> : null}
        <div className="grid gap-4">
          {data?.books.map((b) => (
            <BookCard key={b.id} book={b} />
          ))}
        </div>
      </section>
    </div>
  );
}
