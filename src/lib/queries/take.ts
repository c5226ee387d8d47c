import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TakeResponse } from '@shared/schemas/takes';
import { api } from '@/lib/api-client';
import { takeKeys } from './keys';

export { takeKeys };

/** GET /api/takes/:id, cached once whichever page (the player's, the teacher's review) asks. */
export const takeQueryOptions = (id: string) =>
  queryOptions({
    queryKey: takeKeys.one(id),
    queryFn: () => api.get<TakeResponse>(`/api/takes/${encodeURIComponent(id)}`),
  });

export function useTake(id: string) {
  return useQuery(takeQueryOptions(id));
}
