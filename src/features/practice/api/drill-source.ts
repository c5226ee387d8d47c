import type { SavedDrillResponse } from '@shared/schemas/drills';
import { api } from '@/lib/api-client';

/** A saved drill (mine, or my studio teacher's) to practise. */
export function fetchSavedDrill(id: string): Promise<SavedDrillResponse> {
  return api.get<SavedDrillResponse>(`/api/drills/${encodeURIComponent(id)}`);
}
