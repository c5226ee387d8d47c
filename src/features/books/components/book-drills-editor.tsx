import type { Book, BookDrillEntry } from '@shared/schemas/books';
import type { KeyOrder } from '@shared/schemas/drills';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { useRemoveBookDrill, useReorderBook, useUpdateBookDrill } from '../api/books';

export const CYCLE_OPTIONS: { value: '' | KeyOrder; label: string }[] = [
  { value: '', label: 'Own key only' },
  { value: 'chromatic', label: 'All keys, chromatic' },
  { value: 'fourths', label: 'All keys, in fourths' },
  { value: 'fifths', label: 'All keys, in fifths' },
];

function DrillRow({ book, drill, index }: { book: Book; drill: BookDrillEntry; index: number }) {
  const update = useUpdateBookDrill(book.id);
  const remove = useRemoveBookDrill(book.id);
  const reorder = useReorderBook(book.id);
  const [note, setNote] = useState(drill.note);
  const [title, setTitle] = useState(drill.title);
  const ids = book.drills.map((d) => d.id);
  const move = (by: -1 | 1) => {
    const next = [...ids];
    [next[index], next[index + by]] = [next[index + by], next[index]];
    reorder.mutate({ drillIds: next });
  };
  const error = update.error ?? remove.error ?? reorder.error;
  return (
    <li className="grid gap-2 rounded-card border border-line bg-raised p-4" data-testid="edit-drill">
      <div className="flex flex-wrap items-center gap-2">
        <span className="font-bold text-muted">{index + 1}.</span>
        <input
          aria-label={`Title of drill ${index + 1}`}
          value={title}
          onChange={(e) => setTitle(e.target.value)}
          onBlur={() => title !== drill.title && update.mutate({ drillId: drill.id, title })}
          className="min-w-48 flex-1 rounded-lg border border-line bg-raised px-2 py-1 font-bold"
        />
        <span className="text-caption text-muted">{drill.summary}</span>
      </div>
      <label className="grid gap-1 text-caption font-semibold">
        Teaching note
        <textarea
          value={note}
          rows={2}
          maxLength={600}
          onChange={(e) => setNote(e.target.value)}
          onBlur={() => note !== drill.note && update.mutate({ drillId: drill.id, note })}
          className="rounded-lg border border-line bg-raised px-2 py-1 text-body font-normal"
        />
      </label>
      <div className="flex flex-wrap items-center gap-2">
        <select
          aria-label={`Key cycle of drill ${index + 1}`}
          value={drill.keyCycle ?? ''}
          onChange={(e) => update.mutate({ drillId: drill.id, keyCycle: (e.target.value || null) as KeyOrder | null })}
          className="rounded-lg border border-line bg-raised px-2 py-1"
        >
          {CYCLE_OPTIONS.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
        <Button
          variant="quiet"
          onClick={() => move(-1)}
          disabled={index === 0 || reorder.isPending}
          aria-label={`Move ${drill.title} up`}
        >
          ↑ Up
        </Button>
        <Button
          variant="quiet"
          onClick={() => move(1)}
          disabled={index === ids.length - 1 || reorder.isPending}
          aria-label={`Move ${drill.title} down`}
        >
          ↓ Down
        </Button>
        {drill.free ? (
          <span className="rounded-full bg-reed-100 px-2 py-0.5 text-caption font-bold text-reed-700">free to try</span>
        ) : (
          <Button variant="quiet" onClick={() => update.mutate({ drillId: drill.id, free: true })}>
            Make this the free drill
          </Button>
        )}
        <Button
          variant="danger"
          onClick={() => remove.mutate(drill.id)}
          disabled={remove.isPending}
          aria-label={`Remove ${drill.title}`}
        >
          Remove
        </Button>
      </div>
      {error ? <FormMessage tone="error">{error.message}</FormMessage> : null}
    </li>
  );
}

/** The book's drills in order: title, teaching note, key cycle, free mark, up/down, remove. */
export function BookDrillsEditor({ book }: { book: Book }) {
  if (book.drills.length === 0) return <p className="text-muted">No drills yet: add one of your saved drills below.</p>;
  return (
    <ol className="grid gap-3" aria-label="Drills in this book">
      {book.drills.map((d, i) => (
        <DrillRow key={d.id} book={book} drill={d} index={i} />
      ))}
    </ol>
  );
}
