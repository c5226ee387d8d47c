import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreateStudioInput, StudioResponse, StudiosResponse } from '@shared/schemas/studios';
import { api } from '@/lib/api-client';
import { studioKeys } from '@/lib/queries/keys';

export function fetchStudios(): Promise<StudiosResponse> {
  return api.get<StudiosResponse>('/api/studios');
}

export const studiosQueryOptions = queryOptions({ queryKey: studioKeys.list, queryFn: fetchStudios });

/** The studios the signed-in user teaches or belongs to. */
export function useStudios() {
  return useQuery(studiosQueryOptions);
}

export const studioQueryOptions = (id: string) =>
  queryOptions({
    queryKey: studioKeys.detail(id),
    queryFn: () => api.get<StudioResponse>(`/api/studios/${encodeURIComponent(id)}`),
  });

export function useStudio(id: string) {
  return useQuery(studioQueryOptions(id));
}

export function useCreateStudio() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateStudioInput) => api.post<StudioResponse>('/api/studios', input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: studioKeys.all }),
  });
}

/** A player leaves a studio. */
export function useLeaveStudio() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.delete<void>(`/api/studios/${encodeURIComponent(id)}/membership`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: studioKeys.all }),
  });
}
