import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { useCreateBook } from '../api/books';

/** Starts a draft book and opens its editor. */
export function NewBookForm() {
  const form = useSchemaForm(() => import('@shared/schemas/books').then((m) => m.CreateBookInput), {
    defaultValues: { title: '' },
  });
  const create = useCreateBook();
  const navigate = useNavigate();
  const submit = form.handleSubmit((input) =>
    create.mutate(input, { onSuccess: ({ book }) => navigate(`/books/${book.id}/edit`), onError: form.fromError }),
  );
  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-3">
      <TextField
        label="New book title"
        maxLength={120}
        className="min-w-64 flex-1"
        errors={form.errorsOf('title')}
        {...form.register('title')}
      />
      <Button type="submit" disabled={create.isPending}>
        Start a book
      </Button>
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
    </form>
  );
}
