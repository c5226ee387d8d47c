import { DrillSpec, KeyOrder } from '@shared/schemas/drills';

/** A drill spec and key order carried in a page address (?spec=<JSON>&order=...). */
export function specToParams(spec: DrillSpec, order: KeyOrder): URLSearchParams {
  return new URLSearchParams({ spec: JSON.stringify(spec), order });
}

/** Reads ?spec= and ?order=; null parts when missing or not valid. */
export function specFromParams(params: URLSearchParams): { spec: DrillSpec | null; order: KeyOrder } {
  const order = KeyOrder.safeParse(params.get('order') ?? 'chromatic');
  let spec: DrillSpec | null = null;
  const raw = params.get('spec');
  if (raw) {
    try {
      const parsed = DrillSpec.safeParse(JSON.parse(raw));
      if (parsed.success) spec = parsed.data;
    } catch {
      spec = null;
    }
  }
  return { spec, order: order.success ? order.data : 'chromatic' };
}
