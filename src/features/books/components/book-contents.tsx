import type { Book } from '@shared/schemas/books';
import { Button } from '@/components/ui/button';
import { usePractiseDrill } from '../hooks/use-practise-drill';

const ORDER: Record<string, string> = {
  chromatic: 'all 12 keys, chromatic',
  fourths: 'all 12 keys, in fourths',
  fifths: 'all 12 keys, in fifths',
};

/** The contents of a book, in order; a drill the viewer may open gets a Practise button. */
export function BookContents({ book, canPractise }: { book: Book; canPractise: boolean }) {
  const { practise, error, opening } = usePractiseDrill(book.id);
  const fullAccess = book.access !== 'free-drill-only';
  return (
    <section aria-labelledby="contents-heading" className="grid gap-3">
      <h2 id="contents-heading" className="text-lead font-bold">
        Contents
      </h2>
      {error ? (
        <p role="alert" className="font-semibold text-ember-700">
          {error}
        </p>
      ) : null}
      <ol className="grid gap-2">
        {book.drills.map((d, i) => {
          const open = fullAccess || d.free;
          return (
            <li
              key={d.id}
              className="flex flex-wrap items-start gap-3 rounded-card border border-line bg-raised p-4"
              data-testid="book-drill"
            >
              <span className="w-6 text-right font-bold text-muted">{i + 1}.</span>
              <div className="grid min-w-0 flex-1 gap-1">
                <p className="font-bold">
                  {d.title}
                  {d.free ? (
                    <span className="ml-2 rounded-full bg-reed-100 px-2 py-0.5 text-caption font-bold text-reed-700">
                      free to try
                    </span>
                  ) : null}
                </p>
                <p className="text-caption text-muted">
                  {d.summary} · {d.keyCycle ? ORDER[d.keyCycle] : 'one key'}
                </p>
                {d.note ? <p className="text-body">{d.note}</p> : null}
              </div>
              {canPractise && open ? (
                <Button
                  variant={d.free && !fullAccess ? 'primary' : 'quiet'}
                  onClick={() => practise(d.id)}
                  disabled={opening === d.id}
                  aria-label={`Practise ${d.title}`}
                >
                  {opening === d.id ? 'Opening…' : d.free && !fullAccess ? 'Try it free' : 'Practise'}
                </Button>
              ) : null}
              {!open ? <span className="text-caption font-semibold text-muted">in the full book</span> : null}
            </li>
          );
        })}
      </ol>
    </section>
  );
}
