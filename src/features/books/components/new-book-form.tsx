import { type FormEvent, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useCreateBook } from '../api/books';

/** Starts a draft book and opens its editor. */
export function NewBookForm() {
  const [title, setTitle] = useState('');
  const create = useCreateBook();
  const navigate = useNavigate();
  async function submit(e: FormEvent) {
    e.preventDefault();
    const { book } = await create.mutateAsync({
      title,
      description: '',
      coverColour: 'brass',
      priceMinor: 0,
      currency: 'EUR',
    });
    navigate(`/books/${book.id}/edit`);
  }
  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-3">
      <TextField
        label="New book title"
        value={title}
        onChange={(e) => setTitle(e.target.value)}
        required
        maxLength={120}
        className="min-w-64 flex-1"
        errors={(create.error as { fields?: Record<string, string[]> } | null)?.fields?.title}
      />
      <Button type="submit" disabled={create.isPending}>
        Start a book
      </Button>
      {create.error && !(create.error as { fields?: unknown }).fields ? (
        <FormMessage tone="error">{create.error.message}</FormMessage>
      ) : null}
    </form>
  );
}
