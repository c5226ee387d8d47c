import { Link } from 'react-router-dom';
import { useBoard } from '../api/board';
import { dueFormat, pct, StatusBadge } from './status-badge';

const dayFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' });

/** Six weeks of mean accuracy as small bars, oldest first; an empty week is a dot. */
/** Bars start at 50% accuracy: a working studio lives between 80% and 100%, where the change is. */
const TREND_FLOOR = 0.5;

function Trend({ weeks }: { weeks: (number | null)[] }) {
  const known = weeks.filter((w): w is number => w !== null);
  const label = known.length
    ? `Accuracy by week, oldest first (bars from 50% to 100%): ${weeks.map((w) => pct(w)).join(', ')}`
    : 'No takes in six weeks';
  return (
    <span className="inline-flex h-6 items-end gap-0.5" role="img" aria-label={label} title={label}>
      {weeks.map((w, i) => (
        <span
          key={i}
          className={w === null ? 'h-1 w-2 rounded-sm bg-line' : 'w-2 rounded-sm bg-brass-500'}
          style={
            w === null
              ? undefined
              : { height: `${Math.max(8, ((Math.max(TREND_FLOOR, w) - TREND_FLOOR) / (1 - TREND_FLOOR)) * 100)}%` }
          }
        />
      ))}
    </span>
  );
}

/** Players x assignments: each status, last practice and the accuracy trend (the teacher's table). */
export function StudioBoard({ studioId }: { studioId: string }) {
  const { data, isPending, error } = useBoard(studioId);
  if (isPending) return <p className="text-muted">Loading the studio table…</p>;
  if (error)
    return (
      <p role="alert" className="text-ember-700">
        {error.message}
      </p>
    );
  if (data.rows.length === 0) return <p className="text-muted">No players yet: invite them by e-mail below.</p>;
  return (
    <div className="overflow-x-auto rounded-card border border-line bg-raised">
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
                <span className="font-normal">due {dueFormat.format(new Date(a.dueAt))}</span>
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
                {r.lastPracticeAt ? dayFormat.format(new Date(r.lastPracticeAt)) : 'Not yet'}
              </td>
              <td className="whitespace-nowrap px-3 py-2">
                <Trend weeks={r.trend} />{' '}
                <span className="ml-2 text-caption text-muted">
                  {r.takesThisWeek} {r.takesThisWeek === 1 ? 'take' : 'takes'} this week
                </span>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
