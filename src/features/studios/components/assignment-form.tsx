import { useState } from 'react';
import { Link } from 'react-router-dom';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { NumberField } from '@/components/ui/number-field';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useCreateAssignment, useTeacherDrills } from '../api/assignments';

const inAWeek = () => new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10);

const KEYS = [
  { value: '', label: "The drill's own key" },
  { value: 'chromatic', label: 'Key cycle: chromatic' },
  { value: 'fourths', label: 'Key cycle: in fourths' },
  { value: 'fifths', label: 'Key cycle: in fifths' },
];

/** An empty box reads as "not given" (the schema asks for it); anything else as a number. */
const numberOf = (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(v));

function AssignmentFields({ studioId, mine }: { studioId: string; mine: { id: string; name: string }[] }) {
  const create = useCreateAssignment(studioId);
  const [done, setDone] = useState<string | null>(null);
  const form = useSchemaForm(() => import('@shared/schemas/assignments').then((m) => m.AssignmentFormInput), {
    defaultValues: {
      savedDrillId: mine[0]?.id ?? '',
      keyOrder: null,
      dueAt: inAWeek(),
      targetTempo: 100,
      targetAccuracy: 85,
      note: '',
    },
  });
  const onSubmit = form.handleSubmit((input) => {
    setDone(null);
    create.mutate(input, { onSuccess: (res) => setDone(res.assignment.title), onError: form.fromError });
  });
  return (
    <form onSubmit={onSubmit} className="grid gap-3 md:grid-cols-3" noValidate aria-label="New assignment">
      <SelectField
        label="Saved drill"
        options={mine.map((d) => ({ value: d.id, label: d.name }))}
        errors={form.errorsOf('savedDrillId')}
        {...form.register('savedDrillId')}
      />
      <SelectField
        label="Keys"
        options={KEYS}
        errors={form.errorsOf('keyOrder')}
        {...form.register('keyOrder', { setValueAs: (v) => (v === '' ? null : v) })}
      />
      <TextField label="Due" type="date" errors={form.errorsOf('dueAt')} {...form.register('dueAt')} />
      <NumberField
        label="Target tempo (bpm)"
        min={20}
        max={400}
        errors={form.errorsOf('targetTempo')}
        {...form.register('targetTempo', { setValueAs: numberOf })}
      />
      <NumberField
        label="Target accuracy (%)"
        min={5}
        max={100}
        errors={form.errorsOf('targetAccuracy')}
        {...form.register('targetAccuracy', { setValueAs: numberOf })}
      />
      <TextField label="Note to the players" errors={form.errorsOf('note')} {...form.register('note')} />
      <p className="text-caption text-muted md:col-span-3">
        Every whole take of the drill counts, on any instrument, in each key it names, at the target tempo or faster and
        the target accuracy or better, once the assignment is set: from its own button, the drills page or anywhere
        else.
      </p>
      <div className="md:col-span-3 flex items-center gap-3">
        <Button type="submit" disabled={create.isPending}>
          Set the assignment
        </Button>
        {done ? <FormMessage tone="success">Set: {done}</FormMessage> : null}
        {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
      </div>
    </form>
  );
}

/** Set a saved drill (one key or the key cycle) with target tempo, accuracy, due date and a note. */
export function AssignmentForm({ studioId }: { studioId: string }) {
  const drills = useTeacherDrills();
  const mine = drills.data?.drills.filter((d) => d.mine) ?? [];
  if (drills.isPending) return <p className="text-muted">Loading your saved drills…</p>;
  if (mine.length === 0) {
    return (
      <p className="text-muted">
        Save a drill first on the{' '}
        <Link to="/drills" className="underline">
          drills page
        </Link>
        ; then set it here.
      </p>
    );
  }
  return <AssignmentFields studioId={studioId} mine={mine} />;
}
