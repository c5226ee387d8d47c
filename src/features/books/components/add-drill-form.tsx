import type { KeyOrder } from '@shared/schemas/drills';
import { type FormEvent, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { SelectField } from '@/components/ui/select-field';
import { useAddBookDrill, useTeacherSavedDrills } from '../api/books';
import { CYCLE_OPTIONS } from './book-drills-editor';

/** Adds one of the teacher's saved drills to the book (its spec is copied in as it is now). */
export function AddDrillForm({ bookId }: { bookId: string }) {
  const saved = useTeacherSavedDrills();
  const add = useAddBookDrill(bookId);
  const mine = saved.data?.drills.filter((d) => d.mine) ?? [];
  const [drillId, setDrillId] = useState('');
  const [cycle, setCycle] = useState<'' | KeyOrder>('chromatic');
  const [note, setNote] = useState('');
  const chosen = drillId || mine[0]?.id || '';
  function submit(e: FormEvent) {
    e.preventDefault();
    // A refusal shows under the form (add.error); the note stays for another try.
    add.mutate({ savedDrillId: chosen, note, keyCycle: cycle || null }, { onSuccess: () => setNote('') });
  }
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
  return (
    <form
      onSubmit={submit}
      className="grid gap-3 rounded-card border border-dashed border-line p-4"
      aria-label="Add a drill"
    >
      <div className="flex flex-wrap gap-3">
        <SelectField
          label="Saved drill"
          value={chosen}
          onChange={(e) => setDrillId(e.target.value)}
          options={mine.map((d) => ({ value: d.id, label: d.name }))}
          className="min-w-64 flex-1"
        />
        <SelectField
          label="Key cycle"
          value={cycle}
          onChange={(e) => setCycle(e.target.value as '' | KeyOrder)}
          options={CYCLE_OPTIONS}
          className="w-56"
        />
      </div>
      <label className="grid gap-1 font-semibold">
        Teaching note
        <textarea
          value={note}
          onChange={(e) => setNote(e.target.value)}
          rows={2}
          maxLength={600}
          className="rounded-lg border border-line bg-raised px-3 py-2 font-normal"
        />
      </label>
      {add.error ? <FormMessage tone="error">{add.error.message}</FormMessage> : null}
      <Button type="submit" disabled={add.isPending || !chosen} className="justify-self-start">
        Add to the book
      </Button>
    </form>
  );
}
