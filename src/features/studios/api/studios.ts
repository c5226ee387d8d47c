import { queryOptions, useQuery } from '@tanstack/react-query';
import type { StudiosResponse } from '@shared/schemas/studios';
import { api } from '@/lib/api-client';

export const studiosKey = ['studios'] as const;

export function fetchStudios(): Promise<StudiosResponse> {
  return api.get<StudiosResponse>('/api/studios');
}

export const studiosQueryOptions = queryOptions({ queryKey: studiosKey, queryFn: fetchStudios });

/** The studios the signed-in user teaches or belongs to. */
export function useStudios() {
  return useQuery(studiosQueryOptions);
}
