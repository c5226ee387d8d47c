import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreateSavedDrillInput, SavedDrillResponse, SavedDrillsResponse } from '@shared/schemas/drills';
import { api } from '@/lib/api-client';

export const savedDrillsKey = ['drills', 'saved'] as const;

export function fetchSavedDrills(): Promise<SavedDrillsResponse> {
  return api.get<SavedDrillsResponse>('/api/drills');
}

export const savedDrillsQueryOptions = queryOptions({ queryKey: savedDrillsKey, queryFn: fetchSavedDrills });

/** The user's saved drills and their studios' teachers'. */
export function useSavedDrills() {
  return useQuery(savedDrillsQueryOptions);
}

export function saveDrill(input: CreateSavedDrillInput): Promise<SavedDrillResponse> {
  return api.post<SavedDrillResponse>('/api/drills', input);
}

export function useSaveDrill() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveDrill,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: savedDrillsKey }),
  });
}

export function deleteSavedDrill(id: string): Promise<void> {
  return api.delete<void>(`/api/drills/${encodeURIComponent(id)}`);
}

export function useDeleteSavedDrill() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteSavedDrill,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: savedDrillsKey }),
  });
}
