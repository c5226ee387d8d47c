import type { BoardRow } from '@shared/schemas/assignments';
import type { ColumnDef } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import { TrendBars, trendDomain } from '@/components/charts/trend-bars';
import { DataTable } from '@/components/ui/data-table';
import { useBoard } from '../api/board';
import { pct, StatusBadge } from './status-badge';
import { formatDate, formatDue } from '@/lib/format-date';

/** The board's weeks count back from now in sevens of days, oldest first. */
const WEEK_LABELS = ['5 weeks ago', '4 weeks ago', '3 weeks ago', '2 weeks ago', 'last week', 'the last 7 days'];

/** Players x assignments: each status, last practice and the accuracy trend (the teacher's table). */
export function StudioBoard({ studioId }: { studioId: string }) {
  const { data, isPending, error } = useBoard(studioId);
  if (isPending) return <p className="text-muted">Loading the studio table…</p>;
  if (error)
    return (
      <p role="alert" className="text-ember-700 dark:text-ember-100">
        {error.message}
      </p>
    );
  if (data.rows.length === 0) return <p className="text-muted">No players yet: invite them by e-mail below.</p>;
  // One scale for every row, from the figures in the table, so rows compare at a glance.
  const domain = trendDomain(
    data.rows.flatMap((r) => r.trend),
    { minSpan: 0.1, floor: 0, ceiling: 1 },
  );
  const columns: ColumnDef<BoardRow>[] = [
    {
      id: 'player',
      header: 'Player',
      cell: ({ row: { original: r } }) => (
        <Link
          to={`/studio/${studioId}/players/${r.player.id}`}
          className="underline decoration-brass-500 underline-offset-4"
        >
          {r.player.name}
        </Link>
      ),
      meta: { rowHeader: true, nowrap: true },
    },
    ...data.assignments.map(
      (a): ColumnDef<BoardRow> => ({
        id: a.id,
        header: () => (
          <>
            <span className="block min-w-32 max-w-48">{a.title}</span>
            <span className="font-normal">due {formatDue(a.dueAt)}</span>
          </>
        ),
        cell: ({ row: { original: r } }) => (r.statuses[a.id] ? <StatusBadge status={r.statuses[a.id]} /> : '—'),
        meta: { wrapHeader: true, headerClassName: 'normal-case tracking-normal' },
      }),
    ),
    {
      id: 'lastPractice',
      header: 'Last practice',
      cell: ({ row: { original: r } }) => (r.lastPracticeAt ? formatDate(r.lastPracticeAt) : 'Not yet'),
      meta: { nowrap: true, cellClassName: 'text-muted' },
    },
    {
      id: 'trend',
      header: 'Accuracy, 6 weeks',
      cell: ({ row: { original: r } }) => (
        <>
          <TrendBars
            values={r.trend}
            labels={WEEK_LABELS}
            format={(v) => pct(v)}
            what={`${r.player.name}'s accuracy`}
            domain={domain}
          />{' '}
          <span className="ml-2 text-caption text-muted">
            {r.takesThisWeek} {r.takesThisWeek === 1 ? 'take' : 'takes'} this week
          </span>
        </>
      ),
      meta: { nowrap: true },
    },
  ];
  return (
    <DataTable
      data={data.rows}
      columns={columns}
      getRowId={(r) => r.player.id}
      caption="Players and assignments"
      testId="studio-board"
    />
  );
}
