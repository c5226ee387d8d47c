import { HistoryTable } from '@/features/history/components/history-table';
import { ImportForm } from '@/features/history/components/import-form';
import { useMe } from '@/features/auth/api/session';

/** Every take, newest first; a MIDI file from elsewhere comes in here too. */
export function HistoryRoute() {
  const { user } = useMe();
  return (
    <section className="grid gap-6">
      <header>
        <h1 className="text-display">Takes</h1>
        <p className="mt-2 text-muted">Sort by a column, filter by key or pattern, open a take to see and hear it.</p>
      </header>
      <HistoryTable />
      {user?.role === 'player' ? (
        <details className="rounded-card border border-line bg-raised p-4">
          <summary className="cursor-pointer font-bold">Import a take recorded elsewhere</summary>
          <div className="mt-4">
            <ImportForm />
          </div>
        </details>
      ) : null}
    </section>
  );
}
