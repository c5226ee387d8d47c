import { type Book, COVER_COLOURS, CURRENCIES } from '@shared/schemas/books';
import { useState } from 'react';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { Button } from '@/components/ui/button';
import { RadioField } from '@/components/ui/check-field';
import { FormMessage } from '@/components/ui/form-message';
import { SelectField } from '@/components/ui/select-field';
import { TextAreaField } from '@/components/ui/text-area-field';
import { TextField } from '@/components/ui/text-field';
import { useUpdateBook } from '../api/books';
import { COVER_CLASS } from './cover';

/** Title, description, cover colour and price of a book; publishing it, or taking it back. */
export function BookDetailsForm({ book }: { book: Book }) {
  const update = useUpdateBook(book.id);
  // The price is typed as money; the shared schema turns it into minor units as the server stores it.
  const form = useSchemaForm(() => import('@shared/schemas/books').then((m) => m.BookDetailsInput), {
    defaultValues: {
      title: book.title,
      description: book.description,
      coverColour: book.coverColour,
      priceMinor: (book.priceMinor / 100).toFixed(2),
      currency: book.currency,
    },
  });
  const [saved, setSaved] = useState(false);
  const cover = form.watch('coverColour');

  // A refusal shows on its fields; nothing typed is lost.
  const save = form.handleSubmit((input) => {
    setSaved(false);
    update.mutate(input, { onSuccess: () => setSaved(true), onError: form.fromError });
  });
  const publish = () =>
    update.mutate({ published: !book.published }, { onSuccess: () => setSaved(false), onError: form.fromError });
  return (
    <form
      onSubmit={save}
      className="grid gap-4 rounded-card border border-line bg-raised p-5"
      aria-label="Book details"
      noValidate
    >
      <TextField label="Title" required maxLength={120} errors={form.errorsOf('title')} {...form.register('title')} />
      <TextAreaField
        id="book-description"
        label="Description"
        rows={3}
        maxLength={2000}
        errors={form.errorsOf('description')}
        {...form.register('description')}
      />
      <fieldset className="grid gap-2">
        <legend className="text-body font-semibold">Cover colour</legend>
        <div className="flex flex-wrap gap-2">
          {COVER_COLOURS.map((c) => (
            <RadioField
              key={c}
              value={c}
              label={c}
              labelClassName={`flex cursor-pointer items-center gap-2 rounded-lg px-3 py-2 font-semibold ${COVER_CLASS[c]} ${cover === c ? 'ring-4 ring-brass-300' : ''}`}
              {...form.register('coverColour')}
            />
          ))}
        </div>
        {form.errorsOf('coverColour') ? (
          <p className="text-caption font-semibold text-ember-700 dark:text-ember-100">
            {form.errorsOf('coverColour')!.join(' ')}
          </p>
        ) : null}
      </fieldset>
      <div className="flex flex-wrap items-start gap-3">
        <TextField
          label="Price"
          inputMode="decimal"
          hint="0 makes the book free"
          errors={form.errorsOf('priceMinor')}
          className="w-40"
          {...form.register('priceMinor')}
        />
        <SelectField
          label="Currency"
          options={CURRENCIES.map((c) => ({ value: c, label: c }))}
          className="w-32"
          errors={form.errorsOf('currency')}
          {...form.register('currency')}
        />
      </div>
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
      {saved && !form.formError ? <FormMessage tone="success">Saved.</FormMessage> : null}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" disabled={update.isPending}>
          Save details
        </Button>
        <Button variant={book.published ? 'quiet' : 'primary'} onClick={publish} disabled={update.isPending}>
          {book.published ? 'Unpublish' : 'Publish'}
        </Button>
        <span className="self-center text-caption text-muted">
          {book.published ? 'Published: players see it in the catalogue.' : 'Draft: only you see it.'}
        </span>
      </div>
    </form>
  );
}
