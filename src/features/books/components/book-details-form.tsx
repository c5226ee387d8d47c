import { type Book, COVER_COLOURS, CURRENCIES, type CoverColour, type Currency } from '@shared/schemas/books';
import { type FormEvent, useState } from 'react';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import type { ApiError } from '@/lib/api-client';
import { useUpdateBook } from '../api/books';
import { COVER_CLASS } from './cover';

/** Title, description, cover colour and price of a book; publishing it, or taking it back. */
export function BookDetailsForm({ book }: { book: Book }) {
  const update = useUpdateBook(book.id);
  const [title, setTitle] = useState(book.title);
  const [description, setDescription] = useState(book.description);
  const [cover, setCover] = useState<CoverColour>(book.coverColour);
  const [price, setPrice] = useState((book.priceMinor / 100).toFixed(2));
  const [currency, setCurrency] = useState<Currency>(book.currency);
  const [saved, setSaved] = useState(false);
  const fields = (update.error as ApiError | null)?.fields ?? {};
  const priceMinor = Math.round(Number(price.replace(',', '.')) * 100);

  function save(e: FormEvent) {
    e.preventDefault();
    setSaved(false);
    // A refusal shows on its fields (update.error); nothing typed is lost.
    update.mutate(
      {
        title,
        description,
        coverColour: cover,
        priceMinor: Number.isFinite(priceMinor) ? priceMinor : -1,
        currency,
      },
      { onSuccess: () => setSaved(true) },
    );
  }
  return (
    <form
      onSubmit={save}
      className="grid gap-4 rounded-card border border-line bg-raised p-5"
      aria-label="Book details"
    >
      <TextField
        label="Title"
        value={title}
        onChange={(e) => setTitle(e.target.value)}
        required
        maxLength={120}
        errors={fields.title}
      />
      <div className="grid gap-1">
        <label htmlFor="book-description" className="text-body font-semibold">
          Description
        </label>
        <textarea
          id="book-description"
          value={description}
          onChange={(e) => setDescription(e.target.value)}
          rows={3}
          maxLength={2000}
          className="rounded-lg border border-line bg-raised px-3 py-2"
        />
      </div>
      <fieldset className="grid gap-2">
        <legend className="text-body font-semibold">Cover colour</legend>
        <div className="flex flex-wrap gap-2">
          {COVER_COLOURS.map((c) => (
            <label
              key={c}
              className={`flex cursor-pointer items-center gap-2 rounded-lg px-3 py-2 font-semibold ${COVER_CLASS[c]} ${cover === c ? 'ring-4 ring-brass-300' : ''}`}
            >
              <input type="radio" name="cover" value={c} checked={cover === c} onChange={() => setCover(c)} />
              {c}
            </label>
          ))}
        </div>
      </fieldset>
      <div className="flex flex-wrap gap-3">
        <TextField
          label="Price"
          inputMode="decimal"
          value={price}
          onChange={(e) => setPrice(e.target.value)}
          hint="0 makes the book free"
          errors={fields.priceMinor}
          className="w-40"
        />
        <SelectField
          label="Currency"
          value={currency}
          onChange={(e) => setCurrency(e.target.value as Currency)}
          options={CURRENCIES.map((c) => ({ value: c, label: c }))}
          className="w-32"
        />
      </div>
      {update.error && !fields.title && !fields.priceMinor ? (
        <FormMessage tone="error">{update.error.message}</FormMessage>
      ) : null}
      {saved && !update.error ? <FormMessage tone="success">Saved.</FormMessage> : null}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" disabled={update.isPending}>
          Save details
        </Button>
        <Button
          variant={book.published ? 'quiet' : 'primary'}
          onClick={() => update.mutate({ published: !book.published })}
          disabled={update.isPending}
        >
          {book.published ? 'Unpublish' : 'Publish'}
        </Button>
        <span className="self-center text-caption text-muted">
          {book.published ? 'Published: players see it in the catalogue.' : 'Draft: only you see it.'}
        </span>
      </div>
    </form>
  );
}
