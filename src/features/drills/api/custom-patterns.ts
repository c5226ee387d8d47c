import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreateCustomPatternInput, CustomPatternResponse, CustomPatternsResponse } from '@shared/schemas/drills';
import { api } from '@/lib/api-client';
import { customPatternKeys } from '@/lib/queries/keys';

export function fetchCustomPatterns(): Promise<CustomPatternsResponse> {
  return api.get<CustomPatternsResponse>('/api/patterns');
}

export const customPatternsQueryOptions = queryOptions({
  queryKey: customPatternKeys.list,
  queryFn: fetchCustomPatterns,
});

/** The user's own patterns and their studios' teachers'. */
export function useCustomPatterns() {
  return useQuery(customPatternsQueryOptions);
}

export function saveCustomPattern(input: CreateCustomPatternInput): Promise<CustomPatternResponse> {
  return api.post<CustomPatternResponse>('/api/patterns', input);
}

export function useSaveCustomPattern() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveCustomPattern,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: customPatternKeys.all }),
  });
}
