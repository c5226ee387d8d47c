import { EngineError, inAllKeys } from '@shared/engine';
import { useMemo } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { PrintCycle } from '@/features/drills/components/print-cycle';
import { specFromParams } from '@/features/drills/hooks/spec-params';

/** /drills/print?spec=...&order=...: the key cycle as pages to print. */
export function DrillsPrintRoute() {
  const [params] = useSearchParams();
  const { spec, order } = specFromParams(params);
  const built = useMemo(() => {
    if (!spec) return { error: 'This page needs a drill: open it from the Drills page.' };
    try {
      return { cycle: inAllKeys(spec, order) };
    } catch (err) {
      if (err instanceof EngineError) return { error: err.message };
      throw err;
    }
  }, [spec, order]);
  return (
    <div className="grid gap-4">
      <p className="no-print">
        <Link to={`/drills?${params.toString()}`} className="font-semibold text-ink-500 underline dark:text-brass-300">
          ← Back to the drill
        </Link>
      </p>
      {built.cycle ? (
        <PrintCycle cycle={built.cycle} order={order} />
      ) : (
        <p
          role="alert"
          className="rounded-lg border border-ember-500 bg-ember-100 px-3 py-2 font-semibold text-ember-700"
        >
          {built.error}
        </p>
      )}
    </div>
  );
}
