import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { SettingsResponse, UpdateSettingsInput } from '@shared/schemas/settings';
import { api } from '@/lib/api-client';
import { settingsKeys } from '@/lib/queries/keys';

export function fetchSettings(): Promise<SettingsResponse> {
  return api.get<SettingsResponse>('/api/settings');
}

export const settingsQueryOptions = queryOptions({
  queryKey: settingsKeys.mine,
  queryFn: fetchSettings,
  staleTime: 5 * 60_000,
});

/** The player's practice settings (instrument, written-pitch input, range, tempo, latency). */
export function useSettings() {
  return useQuery(settingsQueryOptions);
}

export function updateSettings(input: UpdateSettingsInput): Promise<SettingsResponse> {
  return api.put<SettingsResponse>('/api/settings', input);
}

export function useUpdateSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateSettings,
    onSuccess: (data) => queryClient.setQueryData(settingsKeys.mine, data),
  });
}

export function setLatency(input: { device: string; offsetMs: number }): Promise<SettingsResponse> {
  return api.put<SettingsResponse>('/api/settings/latency', input);
}

export function useSetLatency() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setLatency,
    onSuccess: (data) => queryClient.setQueryData(settingsKeys.mine, data),
  });
}
