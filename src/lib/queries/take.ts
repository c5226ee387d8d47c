import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ListTakesQuery } from '@shared/schemas/history';
import type { TakeResponse } from '@shared/schemas/takes';
import { api } from '@/lib/api-client';

/**
 * Query keys for takes, in one place: every list and every single take sit under ['takes'],
 * so one invalidation of takeKeys.all refreshes them all.
 */
export const takeKeys = {
  all: ['takes'] as const,
  list: (params: Partial<ListTakesQuery>) => ['takes', 'list', params] as const,
  one: (id: string) => ['takes', 'one', id] as const,
};

/** GET /api/takes/:id, cached once whichever page (the player's, the teacher's review) asks. */
export const takeQueryOptions = (id: string) =>
  queryOptions({
    queryKey: takeKeys.one(id),
    queryFn: () => api.get<TakeResponse>(`/api/takes/${encodeURIComponent(id)}`),
  });

export function useTake(id: string) {
  return useQuery(takeQueryOptions(id));
}
