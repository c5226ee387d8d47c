import { type Drill, type DrillSpec, generateDrill, inAllKeys, type KeyOrder } from '@shared/engine';
import { drillKey } from '@shared/practice/drill-identity';
import { useEffect, useMemo, useState } from 'react';

export interface DrillCycle {
  drills: Drill[];
  /** why not every key could be built (the drill's own key may still be practised) */
  error: string | null;
}

function buildCycle(spec: DrillSpec, order: KeyOrder): DrillCycle {
  try {
    return { drills: inAllKeys(spec, order), error: null };
  } catch (err) {
    const why = err instanceof Error ? err.message : 'This drill cannot be built';
    // Some keys may not fit the range; the drill's own key still can be practised.
    try {
      return {
        drills: [generateDrill(spec)],
        error: `Not every key of the cycle fits this range (${why}); practising this key only.`,
      };
    } catch {
      return { drills: [], error: why };
    }
  }
}

/**
 * The drill in every key of the chosen order, and which key is being practised. A page
 * address may name a key to open on (?key=).
 */
export function useDrillCycle(spec: DrillSpec | null, order: KeyOrder, wantedKey: string | null) {
  const cycle = useMemo<DrillCycle>(
    () => (spec ? buildCycle(spec, order) : { drills: [], error: null }),
    [spec, order],
  );
  const [keyIndex, setKeyIndex] = useState(0);
  useEffect(() => {
    if (!wantedKey || cycle.drills.length === 0) return;
    const i = cycle.drills.findIndex((d) => drillKey(d.spec) === wantedKey);
    if (i >= 0) setKeyIndex(i);
  }, [wantedKey, cycle.drills]);
  const fullDrill = cycle.drills[keyIndex] ?? null;
  const nextKey = () => setKeyIndex((i) => (i + 1) % Math.max(1, cycle.drills.length));
  return { cycle, keyIndex, setKeyIndex, nextKey, fullDrill };
}
