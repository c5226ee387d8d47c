import type { Assignment, AssignmentStatus, PlayerProgress } from '../../../shared/schemas/assignments';
import type { AssignmentRow } from '../../db/schema';

/**
 * An assignment as the API shows it: a player sees their own status, the teacher (and admins)
 * every player's progress.
 */
export function presentAssignment(
  row: AssignmentRow,
  studioName: string,
  progress: PlayerProgress[],
  viewer: { id: string; seesAll: boolean },
): Assignment {
  const mine = progress.find((p) => p.playerId === viewer.id);
  const overdue = row.dueAt.getTime() < Date.now();
  const status: AssignmentStatus | null = viewer.seesAll ? null : (mine?.status ?? (overdue ? 'overdue' : 'open'));
  return {
    id: row.id,
    studioId: row.studioId,
    studioName,
    savedDrillId: row.savedDrillId,
    title: row.title,
    spec: row.spec,
    keyOrder: row.keyOrder ?? null,
    keys: row.keys,
    targetTempo: row.targetTempo,
    targetAccuracy: row.targetAccuracy,
    dueAt: row.dueAt.toISOString(),
    note: row.note,
    createdAt: row.createdAt.toISOString(),
    status,
    keysMet: viewer.seesAll ? [] : (mine?.keysMet ?? []),
    ...(viewer.seesAll ? { players: progress } : {}),
  };
}
