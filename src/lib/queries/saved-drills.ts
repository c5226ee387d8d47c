import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SavedDrillsResponse } from '@shared/schemas/drills';
import { api } from '@/lib/api-client';

/** Query keys for saved drills: the list and each one sit under ['drills', 'saved']. */
export const savedDrillKeys = {
  all: ['drills', 'saved'] as const,
  one: (id: string) => ['drills', 'saved', 'one', id] as const,
};

export function fetchSavedDrills(): Promise<SavedDrillsResponse> {
  return api.get<SavedDrillsResponse>('/api/drills');
}

/** GET /api/drills, cached once for the drills page, the assignment form and the book editor. */
export const savedDrillsQueryOptions = queryOptions({ queryKey: savedDrillKeys.all, queryFn: fetchSavedDrills });

/** The user's saved drills and their studios' teachers'. */
export function useSavedDrills() {
  return useQuery(savedDrillsQueryOptions);
}
