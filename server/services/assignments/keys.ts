import { type DrillSpec, inAllKeys } from '../../../shared/engine';
import type { KeyOrder } from '../../../shared/schemas/drills';
import { drillKey } from '../../../shared/practice/drill-identity';

/** The keys an assignment names: the drill's own, or the key cycle's twelve in its order. */
export function assignmentKeys(spec: DrillSpec, keyOrder: KeyOrder | null): string[] {
  if (!keyOrder) return [drillKey(spec)];
  return inAllKeys(spec, keyOrder).map((d) => drillKey(d.spec));
}
