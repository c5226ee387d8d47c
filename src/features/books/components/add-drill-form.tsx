import { Link } from 'react-router-dom';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { SelectField } from '@/components/ui/select-field';
import { TextAreaField } from '@/components/ui/text-area-field';
import { useAddBookDrill, useTeacherSavedDrills } from '../api/books';
import { CYCLE_OPTIONS } from './book-drills-editor';

/** "Own key only" is sent as null. */
const cycleOf = (v: unknown) => (v === '' ? null : v);

function AddDrillFields({ bookId, mine }: { bookId: string; mine: { id: string; name: string }[] }) {
  const add = useAddBookDrill(bookId);
  const form = useSchemaForm(() => import('@shared/schemas/books').then((m) => m.AddBookDrillInput), {
    defaultValues: { savedDrillId: mine[0]?.id ?? '', note: '', keyCycle: 'chromatic' },
  });
  // A refusal shows on its field or under the form; the note stays for another try.
  const submit = form.handleSubmit((input) =>
    add.mutate(input, { onSuccess: () => form.setValue('note', ''), onError: form.fromError }),
  );
  return (
    <form
      onSubmit={submit}
      className="grid gap-3 rounded-card border border-dashed border-line p-4"
      aria-label="Add a drill"
      noValidate
    >
      <div className="flex flex-wrap gap-3">
        <SelectField
          label="Saved drill"
          options={mine.map((d) => ({ value: d.id, label: d.name }))}
          className="min-w-64 flex-1"
          errors={form.errorsOf('savedDrillId')}
          {...form.register('savedDrillId')}
        />
        <SelectField
          label="Key cycle"
          options={CYCLE_OPTIONS}
          className="w-56"
          errors={form.errorsOf('keyCycle')}
          {...form.register('keyCycle', { setValueAs: cycleOf })}
        />
      </div>
      <TextAreaField
        label="Teaching note"
        rows={2}
        maxLength={600}
        errors={form.errorsOf('note')}
        {...form.register('note')}
      />
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
      <Button type="submit" disabled={add.isPending} className="justify-self-start">
        Add to the book
      </Button>
    </form>
  );
}

/** Adds one of the teacher's saved drills to the book (its spec is copied in as it is now). */
export function AddDrillForm({ bookId }: { bookId: string }) {
  const saved = useTeacherSavedDrills();
  const mine = saved.data?.drills.filter((d) => d.mine) ?? [];
  if (saved.isPending) return <p className="text-muted">Loading your saved drills…</p>;
  if (mine.length === 0) {
    return (
      <p className="text-muted">
        Save a drill on the{' '}
        <Link to="/drills" className="underline">
          Drills page
        </Link>{' '}
        first; then add it here.
      </p>
    );
  }
  return <AddDrillFields bookId={bookId} mine={mine} />;
}
