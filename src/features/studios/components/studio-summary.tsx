import { Card } from '@/components/ui/card';
import { useStudios } from '../api/studios';

/** The user's studio(s) in a line or two: name, teacher, how many players. */
export function StudioSummary({ empty }: { empty: string }) {
  const { data, isPending, error } = useStudios();
  if (isPending) return <p className="text-muted">Looking up your studio…</p>;
  if (error)
    return (
      <p role="alert" className="text-ember-700">
        {error.message}
      </p>
    );
  if (data.studios.length === 0) return <p className="text-muted">{empty}</p>;
  return (
    <div className="grid gap-3">
      {data.studios.map((s) => (
        <Card key={s.id} className="p-4">
          <p className="text-lead font-bold">{s.name}</p>
          <p className="text-caption text-muted">
            Teacher: {s.teacher.name} · {s.playerCount} {s.playerCount === 1 ? 'player' : 'players'}
          </p>
          {s.members && s.members.length > 0 ? (
            <p className="mt-2 text-body">{s.members.map((m) => m.name).join(', ')}</p>
          ) : null}
        </Card>
      ))}
    </div>
  );
}
