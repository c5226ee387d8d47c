import { Link } from 'react-router-dom';
import { TrendBars, trendDomain } from '@/components/charts/trend-bars';
import { TableScroll } from '@/components/ui/table-scroll';
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
  return (
    <TableScroll label="Players and assignments, scrolls sideways">
      <table className="w-full text-left text-body" data-testid="studio-board">
        <caption className="sr-only">Players and assignments</caption>
        <thead className="border-b border-line text-caption text-muted">
          <tr>
            <th scope="col" className="px-3 py-2">
              Player
            </th>
            {data.assignments.map((a) => (
              <th scope="col" key={a.id} className="px-3 py-2 font-semibold">
                <span className="block max-w-48">{a.title}</span>
                <span className="font-normal">due {formatDue(a.dueAt)}</span>
              </th>
            ))}
            <th scope="col" className="px-3 py-2">
              Last practice
            </th>
            <th scope="col" className="px-3 py-2">
              Accuracy, 6 weeks
            </th>
          </tr>
        </thead>
        <tbody>
          {data.rows.map((r) => (
            <tr key={r.player.id} className="border-b border-line last:border-0">
              <th scope="row" className="px-3 py-2 font-semibold">
                <Link
                  to={`/studio/${studioId}/players/${r.player.id}`}
                  className="underline decoration-brass-500 underline-offset-4"
                >
                  {r.player.name}
                </Link>
              </th>
              {data.assignments.map((a) => (
                <td key={a.id} className="px-3 py-2">
                  {r.statuses[a.id] ? <StatusBadge status={r.statuses[a.id]} /> : '—'}
                </td>
              ))}
              <td className="whitespace-nowrap px-3 py-2 text-muted">
                {r.lastPracticeAt ? formatDate(r.lastPracticeAt) : 'Not yet'}
              </td>
              <td className="whitespace-nowrap px-3 py-2">
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
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </TableScroll>
  );
}
