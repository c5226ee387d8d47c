import type { TakeSummary } from '@shared/schemas/assignments';
import type { ColumnDef } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import { useStudioPlayer } from '../api/board';
import { DataTable } from '@/components/ui/data-table';
import { AssignmentTrend, creditRule } from './assignment-trend';
import { pct, StatusBadge } from './status-badge';
import { formatDateTime, formatDue } from '@/lib/format-date';

const takeColumns: ColumnDef<TakeSummary>[] = [
  {
    id: 'when',
    header: 'When',
    cell: ({ row: { original: t } }) => (
      <Link className="underline" to={`/takes/${t.id}`}>
        {formatDateTime(t.startedAt)}
      </Link>
    ),
    meta: { nowrap: true },
  },
  {
    id: 'drill',
    header: 'Drill',
    cell: ({ row: { original: t } }) => `${t.pair} · ${t.pattern} · ${t.key}`,
    meta: { nowrap: true },
  },
  { id: 'tempo', header: 'Tempo', accessorKey: 'tempo', meta: { numeric: true } },
  { id: 'accuracy', header: 'Accuracy', cell: ({ row }) => pct(row.original.accuracy), meta: { numeric: true } },
  { id: 'remarks', header: 'Remarks', cell: ({ row }) => row.original.remarkCount || '', meta: { numeric: true } },
];

/** One player as their teacher reviews them: assignments, their takes, and their own views (read-only). */
export function PlayerReview({ studioId, playerId }: { studioId: string; playerId: string }) {
  const { data, isPending, error } = useStudioPlayer(studioId, playerId);
  if (isPending) return <p className="text-muted">Loading…</p>;
  if (error)
    return (
      <p role="alert" className="text-ember-700 dark:text-ember-100">
        {error.message}
      </p>
    );
  const q = `player=${encodeURIComponent(playerId)}`;
  return (
    <div className="grid gap-6">
      <header>
        <h1 className="text-title">{data.player.name}</h1>
        <p className="text-muted">{data.player.email}</p>
        <nav aria-label="Their views" className="mt-2 flex gap-4">
          <Link className="underline" to={`/history?${q}`}>
            History
          </Link>
          <Link className="underline" to={`/progress?${q}`}>
            Maps and charts
          </Link>
        </nav>
      </header>
      <section className="grid gap-2">
        <h2 className="text-lead font-bold">Assignments</h2>
        {data.assignments.length === 0 ? <p className="text-muted">None set yet.</p> : null}
        <ul className="grid gap-3">
          {data.assignments.map((a) => (
            <li key={a.id} className="grid gap-1 rounded-card border border-line bg-raised p-3">
              <span>
                {a.status ? <StatusBadge status={a.status} /> : null} {a.title} · due {formatDue(a.dueAt)} ·{' '}
                {a.keysMet.length}/{a.keys.length} keys
              </span>
              <span className="text-caption text-muted">{creditRule(a)}</span>
              <AssignmentTrend assignmentId={a.id} playerId={playerId} />
            </li>
          ))}
        </ul>
      </section>
      <section className="grid gap-2">
        <h2 className="text-lead font-bold">Takes</h2>
        <DataTable
          data={data.takes}
          columns={takeColumns}
          getRowId={(t) => t.id}
          caption="Takes"
          scrollLabel="Their takes, scrolls sideways"
          testId="player-takes"
          empty="No takes yet."
        />
      </section>
    </div>
  );
}
