import { type Book, formatPrice } from '@shared/schemas/books';
import { Link } from 'react-router-dom';
import { BookCover } from './book-cover';

const ACCESS_LABEL: Record<Book['access'], string> = {
  owner: 'Your book',
  bought: 'Yours',
  'free-book': 'Free',
  'free-drill-only': '',
};

/** A catalogue entry: cover, title, price, and the contents with the drill free to try. */
export function BookCard({ book }: { book: Book }) {
  return (
    <article
      className="flex flex-wrap gap-5 rounded-card border border-line bg-raised p-5"
      aria-labelledby={`book-${book.id}`}
      data-testid="book-card"
    >
      <BookCover book={book} size="sm" />
      <div className="grid min-w-0 flex-1 content-start gap-2">
        <h2 id={`book-${book.id}`} className="text-lead font-bold">
          <Link to={`/books/${book.id}`} className="hover:underline">
            {book.title}
          </Link>
        </h2>
        <p className="text-caption text-muted">
          by {book.teacher.name} · {book.drills.length} drills ·{' '}
          <span className="font-bold text-text">{formatPrice(book.priceMinor, book.currency)}</span>
          {ACCESS_LABEL[book.access] ? (
            <span className="ml-2 rounded-full bg-reed-100 px-2 py-0.5 font-bold text-reed-700">
              {ACCESS_LABEL[book.access]}
            </span>
          ) : null}
        </p>
        {book.description ? <p className="line-clamp-2">{book.description}</p> : null}
        <ol className="list-decimal pl-5 text-caption">
          {book.drills.map((d) => (
            <li key={d.id}>
              {d.title}
              {d.free ? <strong className="text-reed-700"> (free to try)</strong> : null}
            </li>
          ))}
        </ol>
      </div>
    </article>
  );
}
