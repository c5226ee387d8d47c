import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DrillSpec } from '@shared/engine';
import type { SuggestTempoResponse } from '@shared/schemas/settings';
import { api } from '@/lib/api-client';
import { tempoKeys } from '@/lib/queries/keys';

export function fetchSuggestedTempo(spec: DrillSpec): Promise<SuggestTempoResponse> {
  return api.get<SuggestTempoResponse>(`/api/practice/tempo?spec=${encodeURIComponent(JSON.stringify(spec))}`);
}

export const suggestedTempoQueryOptions = (spec: DrillSpec) =>
  queryOptions({ queryKey: tempoKeys.forSpec(spec), queryFn: () => fetchSuggestedTempo(spec), staleTime: 0 });

/** The tempo the server has climbed to for this drill and key (null before the first take). */
export function useSuggestedTempo(spec: DrillSpec | null) {
  return useQuery({ ...suggestedTempoQueryOptions(spec ?? ({} as DrillSpec)), enabled: spec !== null });
}
