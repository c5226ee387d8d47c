import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { MapQuery } from '@shared/schemas/maps';
import type { ApiResponse } from '@shared/schemas/api';
import type { SettingsResponse } from '@shared/schemas/settings';
import { api } from '@/lib/api-client';
import { type MapName, mapKeys, settingsKeys } from '@/lib/queries/keys';

export type MapFilters = Partial<MapQuery>;

const search = (params: Record<string, string | undefined>) => {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v) q.set(k, v);
  const s = q.toString();
  return s ? `?${s}` : '';
};

/** The browser's own time zone: charts count days the way the player lives them. */
export const localTimeZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';

/** One map's query: its key, and its answer typed by the route's entry in the registry of responses. */
const mapQuery = <N extends MapName>(name: N, filters: MapFilters) =>
  queryOptions({
    queryKey: mapKeys.filtered(name, filters),
    queryFn: () => api.get<ApiResponse<`GET /api/maps/${N}`>>(`/api/maps/${name}${search(filters)}`),
  });

export const useKeyMap = (f: MapFilters) => useQuery(mapQuery('keys', f));
export const useRangeMap = (f: MapFilters) => useQuery(mapQuery('range', f));
export const useBeatMap = (f: MapFilters) => useQuery(mapQuery('beats', f));
export const useTimeline = (f: MapFilters) =>
  useQuery(mapQuery('timeline', { ...f, tz: localTimeZone() } as MapFilters));
export const useCalendar = (f: MapFilters) =>
  useQuery(mapQuery('calendar', { ...f, tz: localTimeZone() } as MapFilters));
export const useWhatNext = () => useQuery(mapQuery('next', {}));
export const useWeekly = (f: MapFilters) => useQuery(mapQuery('weekly', { ...f, tz: localTimeZone() } as MapFilters));

/** The player sets (or clears, with null) their weekly minutes goal; the practice log redraws. */
export function useSetWeeklyGoal() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (weeklyMinutesGoal: number | null) => api.put<SettingsResponse>('/api/settings', { weeklyMinutesGoal }),
    onSuccess: (data) => {
      queryClient.setQueryData(settingsKeys.mine, data);
      void queryClient.invalidateQueries({ queryKey: mapKeys.map('calendar') });
    },
  });
}
