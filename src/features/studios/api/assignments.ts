import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  AssignmentResponse,
  AssignmentsResponse,
  AssignmentWeeklyResponse,
  CreateAssignmentInput,
} from '@shared/schemas/assignments';
import { api } from '@/lib/api-client';
import { useSavedDrills } from '@/lib/queries/saved-drills';
import { assignmentKeys, studioKeys } from '@/lib/queries/keys';

/** A player's assignments across their studios, with their own status. */
export function useMyAssignments(enabled = true) {
  return useQuery({
    queryKey: assignmentKeys.mine,
    queryFn: () => api.get<AssignmentsResponse>('/api/assignments'),
    enabled,
  });
}

export function useCreateAssignment(studioId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateAssignmentInput) =>
      api.post<AssignmentResponse>(`/api/studios/${encodeURIComponent(studioId)}/assignments`, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: studioKeys.detail(studioId) }),
  });
}

export function useDeleteAssignment(studioId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.delete<void>(`/api/assignments/${encodeURIComponent(id)}`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: studioKeys.detail(studioId) }),
  });
}

/** The teacher's saved drills, to pick one for an assignment. */
export function useTeacherDrills() {
  return useSavedDrills();
}

/** The practice page, opened on the assignment's drill in one of its keys. */
export function practiceLink(
  a: { id: string; savedDrillId: string | null; targetTempo: number },
  key?: string,
): string | null {
  if (!a.savedDrillId) return null;
  const q = new URLSearchParams({ drill: a.savedDrillId, assignment: a.id, tempo: String(a.targetTempo) });
  if (key) q.set('key', key);
  return `/practice?${q.toString()}`;
}

/** Week over week for one assignment: the teacher gets every player, a player themselves. */
export function useAssignmentWeekly(id: string) {
  const tz = Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
  return useQuery({
    queryKey: assignmentKeys.weekly(id, tz),
    queryFn: () =>
      api.get<AssignmentWeeklyResponse>(
        `/api/assignments/${encodeURIComponent(id)}/weekly?tz=${encodeURIComponent(tz)}`,
      ),
  });
}
