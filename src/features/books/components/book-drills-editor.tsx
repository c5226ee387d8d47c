import type { Book, BookDrillEntry } from '@shared/schemas/books';
import type { KeyOrder } from '@shared/schemas/drills';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { SelectField } from '@/components/ui/select-field';
import { TextAreaField } from '@/components/ui/text-area-field';
import { TextField } from '@/components/ui/text-field';
import { useRemoveBookDrill, useReorderBook, useUpdateBookDrill } from '../api/books';

export const CYCLE_OPTIONS: { value: '' | KeyOrder; label: string }[] = [
  { value: '', label: 'Own key only' },
  { value: 'chromatic', label: 'All keys, chromatic' },
  { value: 'fourths', label: 'All keys, in fourths' },
  { value: 'fifths', label: 'All keys, in fifths' },
];

/** An edit applies when the field is left (the title and note) or changed (the key cycle). */
function DrillRow({ book, drill, index }: { book: Book; drill: BookDrillEntry; index: number }) {
  const update = useUpdateBookDrill(book.id);
  const remove = useRemoveBookDrill(book.id);
  const reorder = useReorderBook(book.id);
  const form = useSchemaForm(() => import('@shared/schemas/books').then((m) => m.UpdateBookDrillInput), {
    defaultValues: { title: drill.title, note: drill.note, keyCycle: drill.keyCycle },
  });
  const ids = book.drills.map((d) => d.id);
  const move = (by: -1 | 1) => {
    const next = [...ids];
    [next[index], next[index + by]] = [next[index + by], next[index]];
    reorder.mutate({ drillIds: next });
  };
  /** Saves one field once it passes the shared schema; a refusal shows on that field. */
  const save = async (name: 'title' | 'note' | 'keyCycle') => {
    const value = form.getValues(name);
    if (value === { title: drill.title, note: drill.note, keyCycle: drill.keyCycle }[name]) return;
    if (!(await form.trigger(name))) return;
    update.mutate({ drillId: drill.id, [name]: value }, { onError: form.fromError });
  };
  const error = remove.error ?? reorder.error;
  return (
    <li className="grid gap-2 rounded-card border border-line bg-raised p-4" data-testid="edit-drill">
      <div className="flex flex-wrap items-start gap-2">
        <span className="mt-9 font-bold text-muted">{index + 1}.</span>
        <TextField
          label="Title"
          aria-label={`Title of drill ${index + 1}`}
          className="min-w-48 flex-1"
          errors={form.errorsOf('title')}
          {...form.register('title', { onBlur: () => save('title') })}
        />
        <span className="mt-9 text-caption text-muted">{drill.summary}</span>
      </div>
      <TextAreaField
        label="Teaching note"
        rows={2}
        maxLength={600}
        errors={form.errorsOf('note')}
        {...form.register('note', { onBlur: () => save('note') })}
      />
      <div className="flex flex-wrap items-end gap-2">
        <SelectField
          label="Key cycle"
          aria-label={`Key cycle of drill ${index + 1}`}
          options={CYCLE_OPTIONS}
          errors={form.errorsOf('keyCycle')}
          {...form.register('keyCycle', { setValueAs: (v) => (v === '' ? null : v), onChange: () => save('keyCycle') })}
        />
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
          <Button
            variant="quiet"
            onClick={() => update.mutate({ drillId: drill.id, free: true }, { onError: form.fromError })}
          >
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
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
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
