import { Link, useParams } from 'react-router-dom';
import { TakeView } from '@/features/history/components/take-view';

/** One take from the history: its score on the notation, replay, MIDI and delete. */
export function HistoryTakeRoute() {
  const { id = '' } = useParams();
  return (
    <section className="grid gap-4">
      <div className="flex flex-wrap gap-4 text-caption font-semibold text-muted">
        <Link to="/history" className="hover:text-text">
          ← All takes
        </Link>
        <Link to={`/takes/${id}`} className="hover:text-text">
          Remarks on this take →
        </Link>
      </div>
      <h1 className="text-display">Take</h1>
      <TakeView id={id} />
    </section>
  );
}
