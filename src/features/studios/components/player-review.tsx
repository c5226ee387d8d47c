import { Link } from 'react-router-dom';
import { useStudioPlayer } from '../api/board';
import { TableScroll } from '@/components/ui/table-scroll';
import { AssignmentTrend, creditRule } from './assignment-trend';
import { pct, StatusBadge } from './status-badge';
import { formatDateTime, formatDue } from '@/lib/format-date';

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
        {data.takes.length === 0 ? <p className="text-muted">No takes yet.</p> : null}
        <TableScroll label="Their takes, scrolls sideways">
          <table className="w-full text-left text-body" data-testid="player-takes">
            <caption className="sr-only">Takes</caption>
            <thead className="text-caption text-muted">
              <tr>
                <th scope="col" className="px-3 py-2">
                  When
                </th>
                <th scope="col" className="px-3 py-2">
                  Drill
                </th>
                <th scope="col" className="px-3 py-2">
                  Tempo
                </th>
                <th scope="col" className="px-3 py-2">
                  Accuracy
                </th>
                <th scope="col" className="px-3 py-2">
                  Remarks
                </th>
              </tr>
            </thead>
            <tbody>
              {data.takes.map((t) => (
                <tr key={t.id} className="border-t border-line">
                  <td className="whitespace-nowrap px-3 py-2">
                    <Link className="underline" to={`/takes/${t.id}`}>
                      {formatDateTime(t.startedAt)}
                    </Link>
                  </td>
                  <td className="whitespace-nowrap px-3 py-2">
                    {t.pair} · {t.pattern} · {t.key}
                  </td>
                  <td className="px-3 py-2 tabular-nums">{t.tempo}</td>
                  <td className="px-3 py-2 tabular-nums">{pct(t.accuracy)}</td>
                  <td className="px-3 py-2">{t.remarkCount || ''}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableScroll>
      </section>
    </div>
  );
}
