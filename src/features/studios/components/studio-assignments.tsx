import { useBoard } from '../api/board';
import { AssignmentTrend, creditRule } from './assignment-trend';
import { formatDue } from '@/lib/format-date';

/** The studio's assignments for its teacher: what counts for each, and every player's weeks. */
export function StudioAssignments({ studioId }: { studioId: string }) {
  const { data } = useBoard(studioId);
  if (!data || data.assignments.length === 0) return null;
  return (
    <section className="grid gap-3" aria-labelledby="studio-assignments-heading">
      <h2 id="studio-assignments-heading" className="text-lead font-bold">
        Assignments, week over week
      </h2>
      <ul className="grid gap-3">
        {data.assignments.map((a) => (
          <li key={a.id} className="grid gap-2 rounded-card border border-line bg-raised p-4">
            <p className="font-bold">
              {a.title} <span className="font-normal text-muted">· due {formatDue(a.dueAt)}</span>
            </p>
            <p className="text-caption text-muted" data-testid="credit-rule">
              {creditRule(a)}
            </p>
            <AssignmentTrend assignmentId={a.id} />
          </li>
        ))}
      </ul>
    </section>
  );
}
