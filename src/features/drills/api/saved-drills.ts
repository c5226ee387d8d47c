import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateSavedDrillInput, SavedDrillResponse } from '@shared/schemas/drills';
import { api } from '@/lib/api-client';
import { fetchSavedDrills, savedDrillKeys, savedDrillsQueryOptions, useSavedDrills } from '@/lib/queries/saved-drills';

export { fetchSavedDrills, savedDrillsQueryOptions, useSavedDrills };

export function saveDrill(input: CreateSavedDrillInput): Promise<SavedDrillResponse> {
  return api.post<SavedDrillResponse>('/api/drills', input);
}

export function useSaveDrill() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveDrill,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: savedDrillKeys.all }),
  });
}

export function deleteSavedDrill(id: string): Promise<void> {
  return api.delete<void>(`/api/drills/${encodeURIComponent(id)}`);
}

export function useDeleteSavedDrill() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteSavedDrill,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: savedDrillKeys.all }),
  });
}
