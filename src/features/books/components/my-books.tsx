import { formatPrice } from '@shared/schemas/books';
import { Link } from 'react-router-dom';
import { useMyBooks } from '../api/books';
import { BookCover } from './book-cover';
import { NewBookForm } from './new-book-form';

/** A teacher's own books, drafts too, with links to edit, preview and print. */
export function MyBooks() {
  const { data, isPending, error } = useMyBooks();
  return (
    <section aria-labelledby="my-books" className="grid gap-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="my-books" className="text-lead font-bold">
          My books
        </h2>
        <Link to="/books/sales" className="font-semibold underline">
          Sales
        </Link>
      </div>
      <NewBookForm />
      {isPending ? <p className="text-muted">Loading your books…</p> : null}
      {error ? <p role="alert">{error.message}</p> : null}
      <ul className="grid gap-3 sm:grid-cols-2">
        {data?.books.map((b) => (
          <li key={b.id} className="flex gap-4 rounded-card border border-line bg-raised p-4">
            <BookCover book={b} size="sm" />
            <div className="grid content-start gap-1">
              <p className="font-bold">{b.title}</p>
              <p className="text-caption text-muted">
                {b.published ? 'Published' : 'Draft'} · {formatPrice(b.priceMinor, b.currency)} · {b.drills.length}{' '}
                drills
              </p>
              <p className="flex flex-wrap gap-3 text-caption font-semibold">
                <Link to={`/books/${b.id}/edit`} className="underline">
                  Edit
                </Link>
                <Link to={`/books/${b.id}`} className="underline">
                  Preview
                </Link>
                <Link to={`/books/${b.id}/print`} className="underline">
                  Print
                </Link>
              </p>
            </div>
          </li>
        ))}
      </ul>
    </section>
  );
}
