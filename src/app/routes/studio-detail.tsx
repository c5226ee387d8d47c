import { useNavigate, useParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { useLeaveStudio, useStudio } from '@/features/studios/api/studios';
import { AssignmentForm } from '@/features/studios/components/assignment-form';
import { InviteForm } from '@/features/studios/components/invite-form';
import { MyAssignments } from '@/features/studios/components/my-assignments';
import { StudioAssignments } from '@/features/studios/components/studio-assignments';
import { StudioBoard } from '@/features/studios/components/studio-board';

/** A studio: the teacher's table, invites and new assignments; a player's assignments and a way out. */
export function StudioDetailRoute() {
  const { id = '' } = useParams();
  const { data, isPending, error } = useStudio(id);
  const leave = useLeaveStudio();
  const navigate = useNavigate();
  if (isPending) return <p className="text-muted">Loading the studio…</p>;
  if (error)
    return (
      <p role="alert" className="text-ember-700">
        {error.message}
      </p>
    );
  const { studio } = data;
  if (studio.role === 'player') {
    return (
      <section className="grid gap-4">
        <h1 className="text-title">{studio.name}</h1>
        <p className="text-muted">Teacher: {studio.teacher.name}</p>
        <MyAssignments />
        <div>
          <Button
            variant="danger"
            onClick={() => {
              if (
                window.confirm(
                  `Leave ${studio.name}? Your takes stay yours; ${studio.teacher.name} will no longer see them.`,
                )
              ) {
                leave.mutate(studio.id, { onSuccess: () => navigate('/studio') });
              }
            }}
          >
            Leave the studio
          </Button>
        </div>
      </section>
    );
  }
  return (
    <section className="grid gap-6">
      <header>
        <h1 className="text-title">{studio.name}</h1>
        <p className="text-muted">
          {studio.players.length} {studio.players.length === 1 ? 'player' : 'players'} · teacher {studio.teacher.name}
        </p>
      </header>
      <StudioBoard studioId={studio.id} />
      <StudioAssignments studioId={studio.id} />
      <Card className="grid gap-3">
        <h2 className="text-lead font-bold">New assignment</h2>
        <AssignmentForm studioId={studio.id} />
      </Card>
      <Card className="grid gap-3">
        <h2 className="text-lead font-bold">Invite a player</h2>
        <InviteForm studioId={studio.id} />
      </Card>
    </section>
  );
}
