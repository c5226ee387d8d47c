import { CreateSavedDrillInput, type DrillSpec, type KeyOrder, type SavedDrill } from '@shared/schemas/drills';
import { drillMaterial } from '@shared/practice/drill-identity';
import { type FormEvent, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { ApiError } from '@/lib/api-client';
import { fieldErrors } from '@/lib/field-errors';
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
  const [name, setName] = useState('');
  const [saved, setSaved] = useState<string | null>(null);
  const [fields, setFields] = useState<Record<string, string[]>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const list = useSavedDrills();
  const save = useSaveDrill();
  const remove = useDeleteSavedDrill();

  function submit(e: FormEvent) {
    e.preventDefault();
    setSaved(null);
    setFormError(null);
    const parsed = CreateSavedDrillInput.safeParse({ name, spec, keyOrder: order });
    setFields(parsed.success ? {} : fieldErrors(parsed.error));
    if (!parsed.success) return;
    save.mutate(parsed.data, {
      onSuccess: ({ drill }) => {
        setSaved(`Saved “${drill.name}”.`);
        setName('');
      },
      onError: (err) => {
        if (err instanceof ApiError && err.fields) setFields(err.fields);
        else setFormError(err.message);
      },
    });
  }

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
          value={name}
          errors={fields.name}
          onChange={(e) => setName(e.target.value)}
          placeholder="D/C over D7, slow"
        />
        <Button type="submit" disabled={save.isPending || !spec}>
          {save.isPending ? 'Saving…' : 'Save drill'}
        </Button>
      </form>
      {formError ? <FormMessage tone="error">{formError}</FormMessage> : null}
      {Object.keys(fields).some((k) => k.startsWith('spec')) ? (
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
