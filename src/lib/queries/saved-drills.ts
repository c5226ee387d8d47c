import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SavedDrillsResponse } from '@shared/schemas/drills';
import { api } from '@/lib/api-client';
import { savedDrillKeys } from './keys';

export { savedDrillKeys };

export function fetchSavedDrills(): Promise<SavedDrillsResponse> {
  return api.get<SavedDrillsResponse>('/api/drills');
}

/** GET /api/drills, cached once for the drills page, the assignment form and the book editor. */
export const savedDrillsQueryOptions = queryOptions({ queryKey: savedDrillKeys.list, queryFn: fetchSavedDrills });

/** The user's saved drills and their studios' teachers'. */
export function useSavedDrills() {
  return useQuery(savedDrillsQueryOptions);
}
