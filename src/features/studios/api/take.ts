import { useQuery } from '@tanstack/react-query';
import type { DrillSpec, PlayedNote, ScoreOptions, TakeScore } from '@shared/engine';
import { api } from '@/lib/api-client';

/** A stored take as GET /api/takes/:id answers (the fields the review page reads). */
export interface ReviewTake {
  id: string;
  playerId: string;
  assignmentId: string | null;
  spec: DrillSpec;
  options: ScoreOptions;
  measures: [number, number] | null;
  played: PlayedNote[];
  score: TakeScore;
  key: string;
  pattern: string;
  pair: string;
  tempo: number;
  accuracy: number;
  startedAt: string;
}

export function useTake(id: string) {
  return useQuery({
    queryKey: ['takes', id],
    queryFn: () => api.get<{ take: ReviewTake }>(`/api/takes/${encodeURIComponent(id)}`),
  });
}
