import type { DrillSpec, KeyOrder, SavedDrill } from '@shared/schemas/drills';
import { drillMaterial } from '@shared/practice/drill-identity';
import { type FormEvent, useState } from 'react';
import { Link } from 'react-router-dom';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useDeleteSavedDrill, useSaveDrill, useSavedDrills } from '../api/saved-drills';

/** Save the drill under a name; open a saved one (yours, or your teacher's). */
export function SavedDrillsPanel({
  spec,
  order,
  onOpen,
  canPractise = false,
}: {
  spec: DrillSpec | null;
  order: KeyOrder;
  onOpen: (d: SavedDrill) => void;
  canPractise?: boolean;
}) {
  const [saved, setSaved] = useState<string | null>(null);
  const list = useSavedDrills();
  const save = useSaveDrill();
  const remove = useDeleteSavedDrill();
  const form = useSchemaForm(() => import('@shared/schemas/drills').then((m) => m.CreateSavedDrillInput), {
    defaultValues: { name: '' },
  });

  // The drill itself comes from the settings above; it is checked with the name, as the server will.
  const submit = (e: FormEvent) => {
    setSaved(null);
    form.setValue('spec', spec as DrillSpec);
    form.setValue('keyOrder', order);
    return form.handleSubmit((input) =>
      save.mutate(input, {
        onSuccess: ({ drill }) => {
          setSaved(`Saved “${drill.name}”.`);
          form.reset({ name: '' });
        },
        onError: form.fromError,
      }),
    )(e);
  };

  const drills = list.data?.drills ?? [];
  const mine = drills.filter((d) => d.mine);
  const shared = drills.filter((d) => !d.mine);
  const row = (d: SavedDrill) => (
    <li key={d.id} className="flex flex-wrap items-center gap-2 border-t border-line py-2" data-testid="saved-drill">
      <span className="flex-1">
        <span className="font-semibold">{d.name}</span>{' '}
        <span className="text-caption text-muted">
          {drillMaterial(d.spec)} · {typeof d.spec.pattern === 'string' ? d.spec.pattern : d.spec.pattern.name}
          {d.mine ? '' : ` · from ${d.owner.name}`}
        </span>
      </span>
      <Button variant="quiet" onClick={() => onOpen(d)} aria-label={`Open ${d.name}`}>
        Open
      </Button>
      {canPractise ? (
        <Link
          to={`/practice?drill=${encodeURIComponent(d.id)}`}
          className="rounded-lg border border-line px-3 py-2 font-semibold hover:border-ink-300"
          aria-label={`Practise ${d.name}`}
        >
          Practise
        </Link>
      ) : null}
      {d.mine ? (
        <Button
          variant="quiet"
          onClick={() => remove.mutate(d.id)}
          aria-label={`Delete ${d.name}`}
          disabled={remove.isPending}
        >
          Delete
        </Button>
      ) : null}
    </li>
  );

  return (
    <section aria-labelledby="saved-heading" className="grid content-start gap-3">
      <h2 id="saved-heading" className="text-lead font-bold">
        Saved drills
      </h2>
      <form onSubmit={submit} noValidate className="flex flex-wrap items-end gap-2" aria-label="Save this drill">
        <TextField
          className="flex-1"
          label="Name for this drill"
          errors={form.errorsOf('name')}
          placeholder="D/C over D7, slow"
          {...form.register('name')}
        />
        <Button type="submit" disabled={save.isPending || !spec}>
          {save.isPending ? 'Saving…' : 'Save drill'}
        </Button>
      </form>
      {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
      {form.formState.errors.spec ? (
        <FormMessage tone="error">Fix the drill above before saving it.</FormMessage>
      ) : null}
      {saved ? <FormMessage tone="success">{saved}</FormMessage> : null}
      {list.isError ? <p className="text-caption text-muted">Your saved drills could not be loaded.</p> : null}
      {mine.length ? (
        <ul aria-label="Your drills" className="grid">
          {mine.map(row)}
        </ul>
      ) : list.isSuccess ? (
        <p className="text-caption text-muted">Nothing saved yet.</p>
      ) : null}
      {shared.length ? (
        <>
          <h3 className="font-bold">From your teachers</h3>
          <ul aria-label="Drills from your teachers" className="grid">
            {shared.map(row)}
          </ul>
        </>
      ) : null}
    </section>
  );
}
