import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/components/form/use-schema-form';
import { FormMessage } from '@/components/ui/form-message';
import { useCreateStudio, useStudios } from '../api/studios';

/** The studios I teach or belong to, and (for a teacher) a form to start one. */
export function StudioList({ canCreate }: { canCreate: boolean }) {
  const { data, isPending, error } = useStudios();
  const create = useCreateStudio();
  const form = useSchemaForm(() => import('@shared/schemas/studios').then((m) => m.CreateStudioInput), {
    defaultValues: { name: '' },
  });
  const onSubmit = form.handleSubmit((input) =>
    create.mutate(input, { onSuccess: () => form.reset({ name: '' }), onError: form.fromError }),
  );
  return (
    <div className="grid gap-4">
      {isPending ? <p className="text-muted">Looking up your studios…</p> : null}
      {error ? (
        <p role="alert" className="text-ember-700">
          {error.message}
        </p>
      ) : null}
      {data && data.studios.length === 0 ? <p className="text-muted">No studios yet.</p> : null}
      <ul className="grid gap-3 md:grid-cols-2">
        {data?.studios.map((s) => (
          <li key={s.id}>
            <Link
              to={`/studio/${s.id}`}
              className="block rounded-card border border-line bg-raised p-4 hover:border-brass-500"
            >
              <span className="block text-lead font-bold">{s.name}</span>
              <span className="text-caption text-muted">
                {s.role === 'player'
                  ? `Teacher: ${s.teacher.name}`
                  : `${s.playerCount} ${s.playerCount === 1 ? 'player' : 'players'}`}
              </span>
            </Link>
          </li>
        ))}
      </ul>
      {canCreate ? (
        <Card className="p-4">
          <form onSubmit={onSubmit} className="flex flex-wrap items-end gap-3" noValidate>
            <TextField
              label="New studio"
              errors={form.errorsOf('name')}
              placeholder="Tuesday combo"
              {...form.register('name')}
            />
            <Button type="submit" disabled={create.isPending}>
              Start the studio
            </Button>
            {form.formError ? <FormMessage tone="error">{form.formError}</FormMessage> : null}
          </form>
        </Card>
      ) : null}
    </div>
  );
}
