import type { DrillSpec } from '@shared/engine';
import { useQuery } from '@tanstack/react-query';
import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { specFromParams } from '@/features/drills/hooks/spec-params';
import { fetchSavedDrill } from '@/features/practice/api/drill-source';
import { useSettings } from '@/features/practice/api/settings';
import { PracticeRoom } from '@/features/practice/components/practice-room';
import { savedDrillKeys } from '@/lib/queries/saved-drills';
import { initialOptions } from '@/features/practice/lib/initial-options';

/** The free starter drill of the demo studio: C/D over Cmaj7#11. */
const STARTER: DrillSpec = {
  pair: ['C', 'D'],
  pattern: 'stack',
  direction: 'up-down',
  chord: 'Cmaj7#11',
  range: { low: 60, high: 84 },
};

/** A tempo from the page address (an assignment's target), when it is one a take can run at. */
function tempoFrom(params: URLSearchParams): number | null {
  const t = Number(params.get('tempo'));
  return params.get('tempo') !== null && t >= 20 && t <= 400 ? t : null;
}

/** Loads what the practice room needs (the drill, saved or from the address, and the player's settings). */
export function PracticeRoute() {
  const [params] = useSearchParams();
  const fromParams = useMemo(() => specFromParams(params), [params]);
  const savedId = params.get('drill');
  const saved = useQuery({
    queryKey: savedDrillKeys.one(savedId ?? ''),
    queryFn: () => fetchSavedDrill(savedId ?? ''),
    enabled: !!savedId,
  });
  const settings = useSettings();

  if (savedId && saved.isError) {
    return <p role="alert">That saved drill could not be opened: {(saved.error as Error).message}</p>;
  }
  const baseSpec: DrillSpec | null = savedId ? (saved.data?.drill.spec ?? null) : (fromParams.spec ?? STARTER);
  if (!baseSpec || !settings.data) return <p role="status">Getting the practice room ready…</p>;

  const s = settings.data.settings;
  return (
    <PracticeRoom
      baseSpec={baseSpec}
      settings={s}
      initialOptions={initialOptions(baseSpec, s, saved.data?.drill.keyOrder ?? fromParams.order, tempoFrom(params))}
      assignmentId={params.get('assignment')}
      wantedKey={params.get('key')}
    />
  );
}
