import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BoardResponse, StudioPlayerResponse } from '@shared/schemas/assignments';
import { api } from '@/lib/api-client';
import { studioKeys } from '@/lib/queries/keys';

export const boardQueryOptions = (studioId: string) =>
  queryOptions({
    queryKey: studioKeys.board(studioId),
    queryFn: () => api.get<BoardResponse>(`/api/studios/${encodeURIComponent(studioId)}/board`),
  });

/** The studio table: players x assignments (the teacher's). */
export function useBoard(studioId: string) {
  return useQuery(boardQueryOptions(studioId));
}

export function useStudioPlayer(studioId: string, playerId: string) {
  return useQuery({
    queryKey: studioKeys.player(studioId, playerId),
    queryFn: () =>
      api.get<StudioPlayerResponse>(
        `/api/studios/${encodeURIComponent(studioId)}/players/${encodeURIComponent(playerId)}`,
      ),
  });
}
