import type { KeyOrder } from '@shared/schemas/drills';
import { type FormEvent, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/form-message';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { ApiError } from '@/lib/api-client';
import { useCreateAssignment, useTeacherDrills } from '../api/assignments';

const inAWeek = () => new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10);

const KEYS = [
  { value: '', label: "The drill's own key" },
  { value: 'chromatic', label: 'Key cycle: chromatic' },
  { value: 'fourths', label: 'Key cycle: in fourths' },
  { value: 'fifths', label: 'Key cycle: in fifths' },
];

/** Set a saved drill (one key or the key cycle) with target tempo, accuracy, due date and a note. */
export function AssignmentForm({ studioId }: { studioId: string }) {
  const drills = useTeacherDrills();
  const create = useCreateAssignment(studioId);
  const mine = drills.data?.drills.filter((d) => d.mine) ?? [];
  const [drillId, setDrillId] = useState('');
  const [keys, setKeys] = useState('');
  const [tempo, setTempo] = useState('100');
  const [accuracy, setAccuracy] = useState('85');
  const [due, setDue] = useState(inAWeek());
  const [note, setNote] = useState('');
  const [done, setDone] = useState<string | null>(null);
  const chosen = drillId || mine[0]?.id || '';

  const onSubmit = (e: FormEvent) => {
    e.preventDefault();
    setDone(null);
    create.mutate(
      {
        savedDrillId: chosen,
        keyOrder: (keys || null) as KeyOrder | null,
        targetTempo: Number(tempo),
        targetAccuracy: Number(accuracy) / 100,
        // due at the end of the chosen day, in the teacher's own time zone
        dueAt: new Date(`${due}T23:59:00`).toISOString(),
        note,
      },
      { onSuccess: (res) => setDone(res.assignment.title) },
    );
  };
  const err = create.error instanceof ApiError ? create.error : null;
  const f = err?.fields ?? {};
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
  return (
    <form onSubmit={onSubmit} className="grid gap-3 md:grid-cols-3" noValidate aria-label="New assignment">
      <SelectField
        label="Saved drill"
        value={chosen}
        onChange={(e) => setDrillId(e.target.value)}
        options={mine.map((d) => ({ value: d.id, label: d.name }))}
        errors={f.savedDrillId}
      />
      <SelectField
        label="Keys"
        value={keys}
        onChange={(e) => setKeys(e.target.value)}
        options={KEYS}
        errors={f.keyOrder}
      />
      <TextField label="Due" type="date" value={due} onChange={(e) => setDue(e.target.value)} errors={f.dueAt} />
      <TextField
        label="Target tempo (bpm)"
        type="number"
        min={20}
        max={400}
        value={tempo}
        onChange={(e) => setTempo(e.target.value)}
        errors={f.targetTempo}
      />
      <TextField
        label="Target accuracy (%)"
        type="number"
        min={5}
        max={100}
        value={accuracy}
        onChange={(e) => setAccuracy(e.target.value)}
        errors={f.targetAccuracy}
      />
      <TextField label="Note to the players" value={note} onChange={(e) => setNote(e.target.value)} errors={f.note} />
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
        {err && !err.fields ? <FormMessage tone="error">{err.message}</FormMessage> : null}
      </div>
    </form>
  );
}
