import type { Book } from '@shared/schemas/books';
import { COVER_CLASS } from './cover';

/** A book's cover: its colour, title and teacher, with the six-note mark of Sixfold books. */
export function BookCover({
  book,
  size = 'md',
}: {
  book: Pick<Book, 'title' | 'coverColour' | 'teacher'>;
  size?: 'sm' | 'md';
}) {
  return (
    <div
      className={`flex flex-col justify-between rounded-card p-4 shadow-sm ${COVER_CLASS[book.coverColour]} ${size === 'sm' ? 'h-36 w-28' : 'h-56 w-44'}`}
      aria-hidden="true"
    >
      <span className="text-caption font-bold uppercase tracking-[0.2em] opacity-80">Drill book</span>
      <span className={`font-extrabold leading-tight ${size === 'sm' ? 'text-caption' : 'text-lead'}`}>
        {book.title}
      </span>
      <span className="flex items-center justify-between text-caption opacity-90">
        <span>{book.teacher.name}</span>
        <span className="tracking-[-0.15em]">●●●○○○</span>
      </span>
    </div>
  );
}
